// Structural comparison of two JSON values (figure parameters or solver results): differing paths and the largest relative
// difference between numbers. Used by the snapshot comparison page and by the reproduce command's summary.

/** One difference between two JSON values. `path` uses dots for keys and [i] for array indexes ('' is the root). */
export interface JsonDifference {
  path: string;
  /** 'changed': both sides present but unequal; 'added'/'removed': present only in b / only in a; 'type': different JSON types. */
  kind: 'changed' | 'added' | 'removed' | 'type';
  a?: unknown;
  b?: unknown;
  /** For two finite numbers: |a - b| / max(|a|, |b|) (0 when both are 0). Infinity when one side is NaN/Infinity. */
  relativeDifference?: number;
}

/** Differences grouped by their path with the array indexes removed (e.g. `levels[][]`). */
export interface FieldSummary {
  field: string;
  count: number;
  /** Largest relative difference among the numeric differences of this field, or null when none is numeric. */
  largestRelativeDifference: number | null;
  /** Path of the first difference of the field, to point a reader at it. */
  example: string;
}

export interface JsonDiff {
  equal: boolean;
  /** Total number of differences found (may exceed `differences.length`). */
  count: number;
  /** The first `maxListed` differences in document order (keys sorted). */
  differences: JsonDifference[];
  fields: FieldSummary[];
  /** The number pair with the largest relative difference, or null when no numbers differ. */
  largest: { path: string; a: number; b: number; relativeDifference: number } | null;
}

export interface DiffOptions {
  /** Numbers whose relative difference is at most this are treated as equal. Default 0 (exact). */
  relativeTolerance?: number;
  /** How many differences to list individually. Default 100. */
  maxListed?: number;
  /** Top-level or dotted paths to skip entirely (e.g. ['diagnostics']). */
  ignore?: string[];
}

type JsonKind = 'null' | 'number' | 'string' | 'boolean' | 'array' | 'object' | 'undefined';

function kindOf(value: unknown): JsonKind {
  if (value === null) return 'null';
  if (value === undefined) return 'undefined';
  if (Array.isArray(value) || ArrayBuffer.isView(value)) return 'array';
  const t = typeof value;
  if (t === 'number' || t === 'bigint') return 'number';
  if (t === 'string') return 'string';
  if (t === 'boolean') return 'boolean';
  return 'object';
}

/**
 * Relative difference |a - b| / max(|a|, |b|) of two numbers: 0 when equal (including both NaN), Infinity when exactly one is
 * non-finite or they are infinities of opposite sign.
 *
 * @example relativeDifference(1, 1.000001) // returns ~1e-6
 */
export function relativeDifference(a: number, b: number): number {
  if (Object.is(a, b) || a === b) return 0;
  if (Number.isNaN(a) && Number.isNaN(b)) return 0;
  if (!Number.isFinite(a) || !Number.isFinite(b)) return Infinity;
  const scale = Math.max(Math.abs(a), Math.abs(b));
  return Math.abs(a - b) / scale;
}

function joinKey(path: string, key: string): string {
  const plain = /^[A-Za-z_$][\w$-]*$/.test(key);
  if (plain) return path === '' ? key : `${path}.${key}`;
  return `${path}[${JSON.stringify(key)}]`;
}

function fieldOf(path: string): string {
  return path.replace(/\[\d+\]/g, '[]') || '(root)';
}

function elementsOf(value: unknown): ArrayLike<unknown> {
  return value as ArrayLike<unknown>;
}

/**
 * Compare two JSON-like values (plain objects, arrays, typed arrays, numbers, strings, booleans, null).
 * Object keys are visited in sorted order so the listing is deterministic; `undefined` members count as absent.
 *
 * @param a - the reference value (e.g. the snapshot's stored result)
 * @param b - the other value (e.g. the recomputed result)
 * @returns every differing path (the first `maxListed` listed), a per-field summary and the largest relative difference
 * @example
 * diffJson({ levels: [1, 2] }, { levels: [1, 2.5] }).largest
 * // returns { path: 'levels[1]', a: 2, b: 2.5, relativeDifference: 0.2 }
 */
export function diffJson(a: unknown, b: unknown, options: DiffOptions = {}): JsonDiff {
  const tolerance = options.relativeTolerance ?? 0;
  const maxListed = options.maxListed ?? 100;
  const ignore = new Set(options.ignore ?? []);
  const differences: JsonDifference[] = [];
  const fields = new Map<string, FieldSummary>();
  let count = 0;
  let largest: JsonDiff['largest'] = null;

  const record = (d: JsonDifference) => {
    count += 1;
    if (differences.length < maxListed) differences.push(d);
    const field = fieldOf(d.path);
    let summary = fields.get(field);
    if (!summary) {
      summary = { field, count: 0, largestRelativeDifference: null, example: d.path };
      fields.set(field, summary);
    }
    summary.count += 1;
    if (d.relativeDifference !== undefined) {
      summary.largestRelativeDifference = Math.max(summary.largestRelativeDifference ?? 0, d.relativeDifference);
      if (!largest || d.relativeDifference > largest.relativeDifference) {
        largest = { path: d.path, a: d.a as number, b: d.b as number, relativeDifference: d.relativeDifference };
      }
    }
  };

  const walk = (x: unknown, y: unknown, path: string) => {
    if (ignore.has(path)) return;
    const kx = kindOf(x);
    const ky = kindOf(y);
    if (kx === 'undefined' && ky === 'undefined') return;
    if (kx === 'undefined') return record({ path, kind: 'added', b: y });
    if (ky === 'undefined') return record({ path, kind: 'removed', a: x });
    if (kx !== ky) return record({ path, kind: 'type', a: x, b: y });
    switch (kx) {
      case 'number': {
        const nx = Number(x);
        const ny = Number(y);
        const rel = relativeDifference(nx, ny);
        if (rel > tolerance) record({ path, kind: 'changed', a: nx, b: ny, relativeDifference: rel });
        return;
      }
      case 'string':
      case 'boolean':
        if (x !== y) record({ path, kind: 'changed', a: x, b: y });
        return;
      case 'null':
        return;
      case 'array': {
        const ax = elementsOf(x);
        const ay = elementsOf(y);
        const n = Math.max(ax.length, ay.length);
        for (let i = 0; i < n; i++) {
          walk(i < ax.length ? ax[i] : undefined, i < ay.length ? ay[i] : undefined, `${path}[${i}]`);
        }
        return;
      }
      case 'object': {
        const ox = x as Record<string, unknown>;
        const oy = y as Record<string, unknown>;
        const keys = Array.from(new Set([...Object.keys(ox), ...Object.keys(oy)])).sort();
        for (const key of keys) walk(ox[key], oy[key], joinKey(path, key));
        return;
      }
    }
  };

  walk(a, b, '');
  return { equal: count === 0, count, differences, fields: Array.from(fields.values()), largest };
}

function formatValue(value: unknown): string {
  if (value === undefined) return '(absent)';
  const text = JSON.stringify(value);
  if (text === undefined) return String(value);
  return text.length > 60 ? `${text.slice(0, 57)}...` : text;
}

/**
 * A short human-readable summary of a diff, one line per field, for CLI output and logs.
 *
 * @example
 * summarizeDiff(diffJson({ levels: [1, 2] }, { levels: [1, 2.5] }))
 * // returns 'levels[]: 1 difference (largest relative difference 2.000e-1, e.g. levels[1]: 2 -> 2.5)\n' + ...
 */
export function summarizeDiff(diff: JsonDiff): string {
  if (diff.equal) return 'no differences';
  const lines: string[] = [];
  for (const f of diff.fields) {
    const example = diff.differences.find((d) => d.path === f.example);
    const rel = f.largestRelativeDifference === null ? '' : `largest relative difference ${f.largestRelativeDifference.toExponential(3)}, `;
    const shown = example ? `e.g. ${example.path || '(root)'}: ${formatValue(example.a)} -> ${formatValue(example.b)}` : `e.g. ${f.example}`;
    lines.push(`${f.field}: ${f.count} difference${f.count === 1 ? '' : 's'} (${rel}${shown})`);
  }
  if (diff.largest) {
    lines.push(`largest relative difference overall: ${diff.largest.relativeDifference.toExponential(3)} at ${diff.largest.path}`);
  }
  lines.push(`${diff.count} difference${diff.count === 1 ? '' : 's'} in total`);
  return lines.join('\n');
}
