// Limits on the LaTeX math of user-written MDX (notes, and later comments): size of one formula, nesting depth, number of
// formulas, and the KaTeX options (size and macro-expansion caps, no \href/\url or HTML extensions) every compile uses.

/** Characters in one $…$ or $$…$$ formula. A long display equation is a few hundred; this is several times more. */
export const MAX_FORMULA_CHARS = 2_000;
/** Characters of math in one note: KaTeX's output is large, and compiling it costs time in proportion. */
export const MAX_MATH_CHARS = 30_000;
/** Brace/\left nesting in one formula: deep nesting makes KaTeX's layout time grow fast. */
export const MAX_FORMULA_DEPTH = 40;
/** Formulas in one note. */
export const MAX_FORMULAS = 1_000;

/**
 * KaTeX options for rehype-katex: sizes capped at 10 em (so `\rule{9999em}{9999em}` cannot draw a page-sized box), at
 * most 200 macro expansions (so `\def\a{\a\a}` stops at once), no `\href`, `\url`, `\htmlClass` and friends (`trust: false`),
 * and what KaTeX cannot typeset still comes back as a warning with its line (rehype-katex catches it).
 */
export const KATEX_OPTIONS = {
  maxSize: 10,
  maxExpand: 200,
  trust: false,
} as const;

/** The deepest nesting of `{…}` groups and `\left…\right` pairs in a formula (escaped braces `\{` `\}` do not count). */
export function formulaDepth(tex: string): number {
  let depth = 0;
  let deepest = 0;
  for (let i = 0; i < tex.length; i += 1) {
    const ch = tex[i];
    if (ch === '\\') {
      if (tex.startsWith('left', i + 1)) {
        depth += 1;
        i += 4;
      } else if (tex.startsWith('right', i + 1)) {
        depth -= 1;
        i += 5;
      } else {
        i += 1; // skip the escaped character (\{, \}, \\ …)
      }
    } else if (ch === '{') {
      depth += 1;
    } else if (ch === '}') {
      depth -= 1;
    }
    if (depth > deepest) deepest = depth;
  }
  return deepest;
}

/**
 * Why a formula is refused, or null when it is within the limits.
 *
 * @example
 * formulaProblem('x'.repeat(5000)) // 'a formula of 5000 characters is too long (at most 4000)'
 */
export function formulaProblem(tex: string): string | null {
  if (tex.length > MAX_FORMULA_CHARS) {
    return `a formula of ${tex.length} characters is too long (at most ${MAX_FORMULA_CHARS})`;
  }
  const depth = formulaDepth(tex);
  if (depth > MAX_FORMULA_DEPTH) {
    return `a formula nested ${depth} levels deep is too deep (at most ${MAX_FORMULA_DEPTH}); split it`;
  }
  return null;
}
