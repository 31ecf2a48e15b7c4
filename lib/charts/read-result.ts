// Small readers that pull typed arrays and points out of a solver result (plain JSON from the database or the solver) with
// clear errors naming the missing field, so chart builders fail loudly instead of drawing an empty plot.

/** Thrown when a result lacks what a chart needs; the message names the field. */
export class ChartDataError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'ChartDataError';
  }
}

export type Json = Record<string, unknown>;

export function isRecord(value: unknown): value is Json {
  return typeof value === 'object' && value !== null && !Array.isArray(value) && !ArrayBuffer.isView(value);
}

export function asRecord(value: unknown, what: string): Json {
  if (!isRecord(value)) throw new ChartDataError(`${what} must be an object`);
  return value;
}

/** A list of finite numbers (plain array or typed array); null entries become NaN. */
export function numberList(value: unknown, what: string): number[] {
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) return Array.from(value as unknown as ArrayLike<number>);
  if (!Array.isArray(value)) throw new ChartDataError(`${what} must be an array of numbers`);
  return value.map((v, i) => {
    if (v === null) return Number.NaN;
    if (typeof v !== 'number') throw new ChartDataError(`${what}[${i}] must be a number`);
    return v;
  });
}

/** A list of number lists. */
export function numberMatrix(value: unknown, what: string): number[][] {
  if (!Array.isArray(value)) throw new ChartDataError(`${what} must be an array of arrays of numbers`);
  return value.map((row, i) => numberList(row, `${what}[${i}]`));
}

/** A point [x, y]. */
export function point(value: unknown, what: string): [number, number] {
  const list = numberList(value, what);
  if (list.length !== 2) throw new ChartDataError(`${what} must be a point [x, y]`);
  return [list[0], list[1]];
}

/** The first member present among `keys`, or undefined. */
export function pick(record: Json, ...keys: string[]): unknown {
  for (const k of keys) if (record[k] !== undefined) return record[k];
  return undefined;
}

/** Tubes as reported by the solver: [{ at, alpha }] (snapped positions). */
export function tubesOf(result: Json): { at: [number, number]; alpha: number }[] {
  const list = result.tubes;
  if (!Array.isArray(list)) return [];
  return list.filter(isRecord).map((t, i) => ({ at: point(t.at, `tubes[${i}].at`), alpha: Number(t.alpha) }));
}

/** Lattice grid description of a result: spacing, box size and the position of box site (0, 0). */
export interface GridInfo {
  h: number;
  nx: number;
  ny: number;
  origin: [number, number];
}

export function gridOf(value: unknown, what = 'grid'): GridInfo {
  const g = asRecord(value, what);
  const h = Number(g.h);
  const nx = Number(g.nx);
  const ny = Number(g.ny);
  if (!(h > 0) || !Number.isInteger(nx) || !Number.isInteger(ny)) throw new ChartDataError(`${what} must have h, nx and ny`);
  return { h, nx, ny, origin: point(g.origin, `${what}.origin`) };
}

/** Transpose a rectangular matrix. */
export function transpose(m: number[][]): number[][] {
  if (m.length === 0) return [];
  return m[0].map((_, j) => m.map((row) => row[j]));
}

/**
 * Curves (one per level) over `n` steps from a matrix stored either per level ([level][step]) or per step ([step][level]).
 */
export function curvesOver(matrix: number[][], n: number): number[][] {
  if (matrix.length === 0) return [];
  const perLevel = matrix.every((row) => row.length === n);
  if (perLevel && (matrix.length !== n || matrix[0].length === n)) return matrix;
  if (matrix.length === n) return transpose(matrix);
  throw new ChartDataError(`level table does not match the ${n} sweep steps`);
}
