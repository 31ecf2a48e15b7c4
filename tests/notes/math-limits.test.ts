// Hostile math in figure notes: oversized, over-nested and too many formulas are refused with their line; KaTeX's size and
// macro-expansion caps hold for what is accepted. Runs the real MDX parser and KaTeX; nothing is mocked.
import { describe, expect, it } from 'vitest';
import { checkNoteSource } from '@/lib/mdx/check-note';
import { compileNote } from '@/lib/mdx/compile-note';
import { formulaDepth, MAX_FORMULA_CHARS, MAX_FORMULA_DEPTH, MAX_FORMULAS, MAX_MATH_CHARS } from '@/lib/mdx/math-limits';

/** Compiled note code without KaTeX's MathML annotations, which repeat the TeX source verbatim as text. */
function withoutTexSource(code: string): string {
  const stripped = code.replace(/encoding: "application\/x-tex",\s*children: "(?:[^"\\]|\\.)*"/g, '');
  expect(stripped.length).toBeLessThan(code.length);
  return stripped;
}

async function errorsOf(source: string) {
  const result = await checkNoteSource(source);
  expect(result.ok).toBe(false);
  return (result as { ok: false; errors: { line: number; message: string }[] }).errors;
}

describe('math limits of the safe gate', () => {
  it('refuses a formula longer than the limit, naming its line', async () => {
    const long = 'x+'.repeat(MAX_FORMULA_CHARS);
    const errors = await errorsOf(`intro\n\n$${long}$\n`);
    expect(errors[0].line).toBe(3);
    expect(errors[0].message).toMatch(/^line 3: a formula of \d+ characters is too long \(at most 2000\)$/);
  });

  it('refuses a formula nested deeper than the limit (display math too)', async () => {
    const deep = '{'.repeat(MAX_FORMULA_DEPTH + 5) + 'x' + '}'.repeat(MAX_FORMULA_DEPTH + 5);
    const errors = await errorsOf(`$$\n${deep}\n$$\n`);
    expect(errors[0].message).toMatch(/^line 1: a formula nested 45 levels deep is too deep/);
  });

  it('counts \\left…\\right as nesting and ignores escaped braces', () => {
    expect(formulaDepth('\\left( \\left[ x \\right] \\right)')).toBe(2);
    expect(formulaDepth('\\{ \\{ \\{ x \\} \\} \\}')).toBe(0);
    expect(formulaDepth('\\frac{a}{b^{2}}')).toBe(2);
  });

  it('refuses a note with more formulas than the limit', async () => {
    const many = Array.from({ length: MAX_FORMULAS + 1 }, (_, i) => `$x_${i}$`).join(' ');
    const errors = await errorsOf(many);
    expect(errors.map((e) => e.message)).toContain(`line 1: a note may hold at most ${MAX_FORMULAS} formulas`);
  });

  it('refuses a note whose formulas together exceed the math budget, at the formula that crosses it', async () => {
    const formula = `$${'a+b'.repeat(Math.floor(MAX_FORMULA_CHARS / 3))}$`;
    const count = Math.ceil(MAX_MATH_CHARS / (MAX_FORMULA_CHARS - 2)) + 1;
    const source = Array.from({ length: count }, () => formula).join('\n\n');
    const errors = await errorsOf(source);
    expect(errors).toHaveLength(1);
    expect(errors[0].message).toMatch(new RegExp(`^line ${2 * (count - 1) - 1}: the note holds more than 30000 characters of math`));
  });

  it('accepts a realistic note right at the per-formula limit', async () => {
    const ok = await checkNoteSource(`$${'a'.repeat(MAX_FORMULA_CHARS)}$`);
    expect(ok.ok).toBe(true);
  });

  it('caps sizes: a page-sized \\rule is drawn at most 10 em (KaTeX maxSize)', async () => {
    const code = withoutTexSource(await compileNote('$\\rule{9999em}{9999em}$'));
    expect(code).not.toContain('9999em');
    expect(code).toMatch(/width: "10em"/);
  });

  it('stops self-expanding macros (KaTeX maxExpand) with a warning, not a hang or a crash', async () => {
    const result = await checkNoteSource('$\\def\\a{\\a\\a}\\a$');
    expect(result.ok).toBe(true);
    const warnings = (result as { ok: true; warnings: { message: string }[] }).warnings;
    expect(warnings.length).toBe(1);
    expect(warnings[0].message).toMatch(/^line 1: .*(expansion|Too many)/i);
  });

  it('does not honour \\href or \\url (trust off)', async () => {
    const code = withoutTexSource(await compileNote('$\\href{javascript:alert(1)}{x}$ and $\\url{https://example.org}$'));
    expect(code).not.toContain('javascript:alert');
    expect(code).not.toContain('https://example.org');
    expect(code).not.toMatch(/\bhref:/);
  });
});
