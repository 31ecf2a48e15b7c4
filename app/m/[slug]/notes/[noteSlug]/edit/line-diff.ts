// A line diff between two revisions of a note: longest common subsequence over the lines that differ (common head
// and tail trimmed first), as a list of kept / added / removed lines with their numbers on each side.

export interface DiffLine {
  kind: 'same' | 'added' | 'removed';
  text: string;
  /** Line number in the old revision (1-based), for 'same' and 'removed'. */
  oldLine: number | null;
  /** Line number in the new revision (1-based), for 'same' and 'added'. */
  newLine: number | null;
}

/** Above this many cells the middle block is shown as removed-then-added instead of aligned (keeps memory bounded). */
const MAX_LCS_CELLS = 16_000_000;

/**
 * Line diff of two texts.
 *
 * @example
 * lineDiff('a\nb\nc', 'a\nx\nc').map((l) => l.kind) // returns ['same', 'removed', 'added', 'same']
 */
export function lineDiff(before: string, after: string): DiffLine[] {
  const a = before.split('\n');
  const b = after.split('\n');
  let head = 0;
  while (head < a.length && head < b.length && a[head] === b[head]) head++;
  let tail = 0;
  while (tail < a.length - head && tail < b.length - head && a[a.length - 1 - tail] === b[b.length - 1 - tail]) tail++;

  const out: DiffLine[] = [];
  for (let i = 0; i < head; i++) out.push({ kind: 'same', text: a[i], oldLine: i + 1, newLine: i + 1 });

  const midA = a.slice(head, a.length - tail);
  const midB = b.slice(head, b.length - tail);
  const n = midA.length;
  const m = midB.length;
  if ((n + 1) * (m + 1) > MAX_LCS_CELLS) {
    midA.forEach((text, i) => out.push({ kind: 'removed', text, oldLine: head + i + 1, newLine: null }));
    midB.forEach((text, j) => out.push({ kind: 'added', text, oldLine: null, newLine: head + j + 1 }));
  } else {
    // lcs[i * (m + 1) + j] = LCS length of midA[i..] and midB[j..]
    const lcs = new Uint32Array((n + 1) * (m + 1));
    for (let i = n - 1; i >= 0; i--) {
      for (let j = m - 1; j >= 0; j--) {
        lcs[i * (m + 1) + j] =
          midA[i] === midB[j] ? lcs[(i + 1) * (m + 1) + j + 1] + 1 : Math.max(lcs[(i + 1) * (m + 1) + j], lcs[i * (m + 1) + j + 1]);
      }
    }
    let i = 0;
    let j = 0;
    while (i < n || j < m) {
      if (i < n && j < m && midA[i] === midB[j]) {
        out.push({ kind: 'same', text: midA[i], oldLine: head + i + 1, newLine: head + j + 1 });
        i++;
        j++;
      } else if (i < n && (j === m || lcs[(i + 1) * (m + 1) + j] >= lcs[i * (m + 1) + j + 1])) {
        out.push({ kind: 'removed', text: midA[i], oldLine: head + i + 1, newLine: null });
        i++;
      } else {
        out.push({ kind: 'added', text: midB[j], oldLine: null, newLine: head + j + 1 });
        j++;
      }
    }
  }

  for (let k = tail; k > 0; k--) {
    out.push({ kind: 'same', text: a[a.length - k], oldLine: a.length - k + 1, newLine: b.length - k + 1 });
  }
  return out;
}

/** Counts of added and removed lines. */
export function diffStats(lines: DiffLine[]): { added: number; removed: number } {
  let added = 0;
  let removed = 0;
  for (const line of lines) {
    if (line.kind === 'added') added++;
    else if (line.kind === 'removed') removed++;
  }
  return { added, removed };
}
