// CSV export of a solver result's data arrays (RFC 4180: comma separated, CRLF line ends, quotes doubled): one table per group
// of arrays of equal length that share a parent object, plus a key/value table of the scalars. Diagnostics are never exported.

/** One table of a result: a name (dotted path of the group), column headers and rows of cells. */
export interface CsvTable {
  name: string;
  columns: string[];
  rows: (number | string | boolean | null)[][];
}

type Cell = number | string | boolean | null;

const CRLF = '\r\n';

/**
 * Quote one CSV field per RFC 4180 §2: fields holding a comma, quote, CR or LF are enclosed in double quotes and inner quotes
 * doubled. Numbers use JavaScript's shortest round-trip form; null is the empty field.
 *
 * @example csvField('a "b", c') // returns '"a ""b"", c"'
 */
export function csvField(value: Cell): string {
  if (value === null) return '';
  const text = typeof value === 'number' ? numberText(value) : String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

function numberText(n: number): string {
  if (Object.is(n, -0)) return '0';
  return String(n);
}

/** Serialise a table: header line then one line per row, each ending in CRLF (RFC 4180 §2.1–2.3). */
export function tableToCsv(table: CsvTable): string {
  const lines = [table.columns.map(csvField).join(',')];
  for (const row of table.rows) lines.push(row.map(csvField).join(','));
  return lines.join(CRLF) + CRLF;
}

function isNumberArray(value: unknown): value is ArrayLike<number> {
  if (ArrayBuffer.isView(value) && !(value instanceof DataView)) return true;
  return Array.isArray(value) && value.length > 0 && value.every((v) => typeof v === 'number' || v === null);
}

function isScalar(value: unknown): value is Cell {
  return value === null || ['number', 'string', 'boolean'].includes(typeof value);
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value) && !ArrayBuffer.isView(value);
}

/** A rectangular array of number arrays (every row the same non-zero length). */
function isNumberMatrix(value: unknown): value is ArrayLike<number>[] {
  if (!Array.isArray(value) || value.length === 0) return false;
  if (!value.every(isNumberArray)) return false;
  const width = (value[0] as ArrayLike<number>).length;
  return value.every((row) => (row as ArrayLike<number>).length === width);
}

/** Flatten a record of scalars and short tuples into columns: { at: [x, y], gap } -> at[0], at[1], gap. */
function flattenRecord(value: unknown, prefix: string, out: Map<string, Cell>): boolean {
  if (isScalar(value)) {
    out.set(prefix, value);
    return true;
  }
  if (Array.isArray(value) && value.length <= 8 && value.every(isScalar)) {
    value.forEach((v, i) => out.set(`${prefix}[${i}]`, v));
    return true;
  }
  if (isPlainObject(value)) {
    return Object.keys(value)
      .sort()
      .every((k) => flattenRecord(value[k], prefix ? `${prefix}.${k}` : k, out));
  }
  return false;
}

/** Arrays of small records (e.g. degeneracy points) become one table, one row per record. */
function recordsTable(name: string, items: unknown[]): CsvTable | null {
  if (items.length === 0 || !items.every(isPlainObject)) return null;
  const flat: Map<string, Cell>[] = [];
  for (const item of items) {
    const m = new Map<string, Cell>();
    if (!flattenRecord(item, '', m)) return null;
    flat.push(m);
  }
  const columns = Array.from(new Set(flat.flatMap((m) => Array.from(m.keys()))));
  return { name, columns: ['index', ...columns], rows: flat.map((m, i) => [i, ...columns.map((c) => m.get(c) ?? null)]) };
}

/** A matrix becomes a table whose rows run along its longer dimension (levels x steps -> one row per step). */
function matrixTable(name: string, key: string, matrix: ArrayLike<number>[]): CsvTable {
  const outer = matrix.length;
  const inner = matrix[0].length;
  if (inner >= outer) {
    const columns = ['index', ...matrix.map((_, j) => `${key}[${j}]`)];
    const rows: Cell[][] = [];
    for (let i = 0; i < inner; i++) rows.push([i, ...matrix.map((row) => row[i])]);
    return { name, columns, rows };
  }
  const columns = ['index', ...Array.from({ length: inner }, (_, j) => `${key}[][${j}]`)];
  const rows: Cell[][] = matrix.map((row, i) => [i, ...Array.from(row)]);
  return { name, columns, rows };
}

/**
 * Split a result into CSV tables. Inside each object, number arrays of the same length become the columns of one table named
 * after the object's path and the length; rectangular number matrices get a table of their own; arrays of small records
 * (points, tubes) become one row per record; scalars collect in a `summary` key/value table. The `diagnostics` member (timings)
 * is left out, as it is from the result hash.
 *
 * @param result - a solver result (plain JSON, typed arrays allowed)
 * @returns tables in a deterministic order (keys sorted)
 * @example
 * resultCsvTables({ task: 'flux-sweep', alphas: [0, 0.5], tracked: [[1, 2], [3, 4]] }).map((t) => t.name)
 * // returns ['summary', 'tracked', 'data']
 */
export function resultCsvTables(result: unknown): CsvTable[] {
  const tables: CsvTable[] = [];
  const summary: Cell[][] = [];

  const visit = (value: unknown, path: string) => {
    if (!isPlainObject(value)) return;
    const keys = Object.keys(value)
      .filter((k) => !(path === '' && k === 'diagnostics'))
      .sort();
    const groups = new Map<number, string[]>();
    for (const key of keys) {
      const child = value[key];
      const childPath = path ? `${path}.${key}` : key;
      if (child === undefined) continue;
      if (isScalar(child)) summary.push([childPath, child]);
      else if (isNumberArray(child)) {
        const list = groups.get(child.length) ?? [];
        list.push(key);
        groups.set(child.length, list);
      } else if (isNumberMatrix(child)) tables.push(matrixTable(childPath, key, child));
      else if (Array.isArray(child) && child.length > 0 && child.every(isPlainObject)) {
        const table = recordsTable(childPath, child);
        if (table) tables.push(table);
        else child.forEach((item, i) => visit(item, `${childPath}[${i}]`));
      } else if (Array.isArray(child) && child.length > 0 && child.every((c) => Array.isArray(c) && c.every(isNumberArray))) {
        // polylines: [[x, y], ...] per item
        child.forEach((item, i) => {
          const pts = item as ArrayLike<number>[];
          if (pts.length > 0) tables.push(matrixTable(`${childPath}[${i}]`, key, pts));
        });
      } else if (Array.isArray(child) && child.every((c) => isScalar(c))) {
        child.forEach((c, i) => summary.push([`${childPath}[${i}]`, c as Cell]));
      } else if (isPlainObject(child)) visit(child, childPath);
    }
    for (const [length, members] of groups) {
      const name = groups.size === 1 ? path || 'data' : `${path || 'data'} (${length} rows)`;
      const rows: Cell[][] = [];
      for (let i = 0; i < length; i++) {
        rows.push([i, ...members.map((m) => (value[m] as ArrayLike<number>)[i] ?? null)]);
      }
      tables.push({ name, columns: ['index', ...members], rows });
    }
  };

  visit(result, '');
  if (summary.length > 0) tables.unshift({ name: 'summary', columns: ['field', 'value'], rows: summary });
  return tables.map((t) => ({ ...t, rows: t.rows.map((r) => r.map(normaliseCell)) }));
}

function normaliseCell(value: Cell | undefined): Cell {
  if (value === undefined) return null;
  if (typeof value === 'number' && Number.isNaN(value)) return 'NaN';
  return value;
}

/**
 * All of a result's tables as ONE RFC 4180 file in long form, so a single download is a valid CSV with one header:
 * `table,row,column,value` (one line per cell).
 *
 * @example resultCsv({ levels: [1, 2] }).split('\r\n')[1] // returns 'data,0,levels,1'
 */
export function resultCsv(result: unknown): string {
  const lines = ['table,row,column,value'];
  for (const table of resultCsvTables(result)) {
    table.rows.forEach((row, r) => {
      const rowLabel = table.columns[0] === 'index' ? row[0] : r;
      row.forEach((cell, c) => {
        if (table.columns[0] === 'index' && c === 0) return;
        lines.push([table.name, rowLabel, table.columns[c], cell].map((v) => csvField(v as Cell)).join(','));
      });
    });
  }
  return lines.join(CRLF) + CRLF;
}
