// Chart of uploaded data (figures of kind 'uploaded-data'): a table of numeric columns drawn as lines of every column against the
// first one. Accepts { columns, rows } or an array of records; the first numeric column is the x axis.
import { baseSpec, type ChartOptions, type ChartSpec, tidy } from './common';
import { ChartDataError, isRecord } from './read-result';

/** Rows of an uploaded table as records. */
function recordsOf(result: unknown): Record<string, unknown>[] {
  if (Array.isArray(result)) return result.filter(isRecord);
  if (isRecord(result) && Array.isArray(result.columns) && Array.isArray(result.rows)) {
    const columns = result.columns.map(String);
    return result.rows.filter(Array.isArray).map((row) => Object.fromEntries(columns.map((c, i) => [c, (row as unknown[])[i]])));
  }
  if (isRecord(result) && Array.isArray(result.data)) return result.data.filter(isRecord);
  throw new ChartDataError('uploaded data must be { columns, rows } or an array of records');
}

/**
 * Vega-Lite spec of uploaded tabular data: each numeric column after the first against the first.
 *
 * @example uploadedDataSpec({ columns: ['alpha', 'E0'], rows: [[0, 5.78], [0.5, 9.87]] }) // one line, x = alpha
 */
export function uploadedDataSpec(result: unknown, options: ChartOptions = {}): ChartSpec {
  const records = recordsOf(result);
  if (records.length === 0) throw new ChartDataError('uploaded data has no rows');
  const numeric = Object.keys(records[0]).filter((k) => records.every((r) => typeof r[k] === 'number' || r[k] === null));
  if (numeric.length < 2) throw new ChartDataError('uploaded data needs at least two numeric columns');
  const [x, ...ys] = numeric;
  const values = records.flatMap((r) =>
    ys.filter((y) => typeof r[y] === 'number').map((y) => ({ x: tidy(r[x] as number), value: tidy(r[y] as number), column: y })),
  );
  return baseSpec(options, {
    data: { values },
    mark: { type: 'line', point: records.length <= 50, strokeWidth: 1.6 },
    encoding: {
      x: { field: 'x', type: 'quantitative', title: x, scale: { zero: false } },
      y: { field: 'value', type: 'quantitative', title: ys.length === 1 ? ys[0] : 'value', scale: { zero: false } },
      color: { field: 'column', type: 'nominal', title: null, legend: ys.length > 1 ? {} : null },
    },
  });
}
