// CSV export of result data (RFC 4180: CRLF line ends, quoted fields with doubled quotes): one table per group of arrays,
// matrices, records and a summary of scalars; diagnostics left out.
import { describe, expect, it } from 'vitest';
import { csvField, resultCsv, resultCsvTables, tableToCsv } from '@/lib/export/csv';

describe('csv', () => {
  it('quotes per RFC 4180 §2', () => {
    expect(csvField('plain')).toBe('plain');
    expect(csvField('a "b", c')).toBe('"a ""b"", c"');
    expect(csvField('two\r\nlines')).toBe('"two\r\nlines"');
    expect(csvField(null)).toBe('');
    expect(csvField(-0)).toBe('0');
    expect(csvField(0.1 + 0.2)).toBe('0.30000000000000004');
    expect(tableToCsv({ name: 't', columns: ['a', 'b'], rows: [[1, 'x,y']] })).toBe('a,b\r\n1,"x,y"\r\n');
  });

  it('splits a flux-sweep-like result into tables and drops diagnostics', () => {
    const result = {
      task: 'flux-sweep',
      tube: 0,
      alphas: [0, 0.5, 1],
      tracked: [
        [5.7, 9.8, 14.6],
        [14.6, 9.8, 5.7],
      ],
      tubes: [{ at: [0, 0], alpha: 0, requested: [0, 0] }],
      diagnostics: { wallMs: 12, node: 'v20' },
    };
    const tables = resultCsvTables(result);
    expect(tables.map((t) => t.name)).toEqual(['summary', 'tracked', 'tubes', 'data']);
    const tracked = tables.find((t) => t.name === 'tracked')!;
    expect(tracked.columns).toEqual(['index', 'tracked[0]', 'tracked[1]']);
    expect(tracked.rows).toEqual([
      [0, 5.7, 14.6],
      [1, 9.8, 9.8],
      [2, 14.6, 5.7],
    ]);
    expect(tables.find((t) => t.name === 'tubes')!.columns).toEqual(['index', 'alpha', 'at[0]', 'at[1]', 'requested[0]', 'requested[1]']);
    expect(tables.find((t) => t.name === 'data')!.rows).toEqual([[0, 0], [1, 0.5], [2, 1]]);
    const text = tables.map(tableToCsv).join('');
    expect(text).not.toContain('wallMs');
    expect(tables[0].rows).toEqual([['task', 'flux-sweep'], ['tube', 0]]);
  });

  it('nested grids (gap map) and polylines (nodal lines) become their own tables', () => {
    const tables = resultCsvTables({
      gapMap: { xs: [0, 1], ys: [0], gap: [0.5, 0.25] },
      lines: [{ points: [[0, 0], [1, 1], [2, 1]], ends: [{ kind: 'wall' }, { kind: 'tube', tube: 0 }] }],
    });
    const names = tables.map((t) => t.name);
    expect(names).toContain('gapMap (2 rows)');
    expect(names).toContain('gapMap (1 rows)');
    expect(names.some((n) => n.startsWith('lines[0]'))).toBe(true);
  });

  it('one long-form document: table,row,column,value with CRLF', () => {
    const csv = resultCsv({ levels: [1, 2], note: 'a,b' });
    expect(csv.split('\r\n')).toEqual(['table,row,column,value', 'summary,0,field,note', 'summary,0,value,"a,b"', 'data,0,levels,1', 'data,1,levels,2', '']);
  });
});
