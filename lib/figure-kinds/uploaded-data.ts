// The uploaded-data figure kind: a table of columns drawn as lines of every numeric column against the first, with no
// solver task. Its parameters are the table itself, accepted in the shapes the chart reads and stored as { columns, rows }.
import { z } from 'zod';
import { uploadedDataSpec } from '@/lib/charts/uploaded-data';
import type { FigureKindEntry } from './kind-entry';

/** Size limits of an uploaded table (common practice: bound what one request can store; a figure needs few columns). */
export const MAX_TABLE_COLUMNS = 32;
export const MAX_TABLE_ROWS = 20_000;
export const MAX_COLUMN_NAME = 64;
export const MAX_TEXT_CELL = 200;

const columnNameSchema = z
  .string({ error: 'A column name must be text' })
  .trim()
  .min(1, 'A column name cannot be empty')
  .max(MAX_COLUMN_NAME, `A column name has at most ${MAX_COLUMN_NAME} characters`);

const cellSchema = z.union([z.number(), z.string().max(MAX_TEXT_CELL, `A text cell has at most ${MAX_TEXT_CELL} characters`), z.null()], {
  error: 'A cell must be a number, text or null',
});

const rowsSchema = z
  .array(z.array(cellSchema, { error: 'A row must be a list of cells' }), { error: 'rows must be a list of rows' })
  .min(1, 'The table has no rows')
  .max(MAX_TABLE_ROWS, `At most ${MAX_TABLE_ROWS} rows`);

/** The stored form: column names and rows of cells, every row as long as the list of columns. */
const columnsAndRowsSchema = z
  .strictObject({
    columns: z
      .array(columnNameSchema, { error: 'columns must be a list of column names' })
      .min(2, 'The table needs at least two columns')
      .max(MAX_TABLE_COLUMNS, `At most ${MAX_TABLE_COLUMNS} columns`),
    rows: rowsSchema,
  })
  .superRefine((table, ctx) => {
    const seen = new Set<string>();
    table.columns.forEach((name, i) => {
      if (seen.has(name)) ctx.addIssue({ code: 'custom', path: ['columns', i], message: `The column "${name}" appears twice` });
      seen.add(name);
    });
    table.rows.forEach((row, i) => {
      if (row.length !== table.columns.length) {
        ctx.addIssue({ code: 'custom', path: ['rows', i], message: `This row has ${row.length} cells; the table has ${table.columns.length} columns` });
      }
    });
  });

const recordSchema = z.record(columnNameSchema, cellSchema, { error: 'A record must be an object of column -> cell' });
const recordsSchema = z
  .array(recordSchema, { error: 'records must be a list of objects' })
  .min(1, 'The table has no rows')
  .max(MAX_TABLE_ROWS, `At most ${MAX_TABLE_ROWS} rows`);

/** Records -> columns (in order of first appearance) and rows (a missing cell is null). */
function recordsToTable(records: Record<string, string | number | null>[], ctx: z.RefinementCtx): UploadedTable {
  const columns: string[] = [];
  const index = new Map<string, number>();
  for (const record of records) {
    for (const key of Object.keys(record)) {
      if (index.has(key)) continue;
      index.set(key, columns.length);
      columns.push(key);
    }
  }
  if (columns.length > MAX_TABLE_COLUMNS) {
    ctx.addIssue({ code: 'custom', message: `At most ${MAX_TABLE_COLUMNS} columns (the records name ${columns.length})` });
    return z.NEVER;
  }
  if (columns.length < 2) {
    ctx.addIssue({ code: 'custom', message: 'The table needs at least two columns' });
    return z.NEVER;
  }
  return { columns, rows: records.map((record) => columns.map((c) => record[c] ?? null)) };
}

/**
 * The parameters of an uploaded-data figure: `{ columns, rows }`, a list of records, or `{ data: records }` (the shapes
 * the chart reads), stored as `{ columns, rows }`.
 *
 * @example uploadedTableSchema.parse([{ alpha: 0, E0: 5.8 }, { alpha: 0.5, E0: 9.9 }]) // { columns: ['alpha', 'E0'], rows: [[0, 5.8], [0.5, 9.9]] }
 */
export const uploadedTableSchema = z.union(
  [
    columnsAndRowsSchema,
    recordsSchema.transform((records, ctx) => recordsToTable(records, ctx)),
    z.strictObject({ data: recordsSchema }).transform((value, ctx) => recordsToTable(value.data, ctx)),
  ],
  { error: 'Uploaded data must be { columns, rows }, a list of records or { data: records }' },
);
export interface UploadedTable {
  columns: string[];
  rows: (string | number | null)[][];
}
export type UploadedTableInput = z.input<typeof uploadedTableSchema>;

/** The registry entry of uploaded data (no solver task: runs of such figures are refused). */
export const UPLOADED_DATA_KIND: FigureKindEntry<UploadedTable, UploadedTableInput> = {
  label: 'Uploaded data (numeric columns against the first)',
  task: null,
  paramsSchema: uploadedTableSchema,
  defaultParams: () => ({
    columns: ['x', 'y'],
    rows: [
      [0, 0],
      [0.5, 0.25],
      [1, 1],
    ],
  }),
  views: ['lines'],
  chartSpec: (result, options) => uploadedDataSpec(result, options),
  problemAt: null,
};
