// Snapshot citations: one-line citation, BibTeX @misc entry (key, howpublished URL, note with solver version and hash
// prefix) and the LaTeX figure block that includes <label>-v<version>.pdf and cites the snapshot. Invented demo data.
import { describe, expect, it } from 'vitest';
import { citationKey, latexCaption, latexEscape, latexFigureBlock, snapshotBibtex, snapshotCitation, snapshotFileName } from '@/lib/cite/citation';

const input = {
  manuscript: { slug: 'two-flux-lines', title: 'Bound states & two flux lines', authors: ['Ilse Marrow', 'Tomas Vey'] },
  figure: { label: 'gap-map', caption: 'Gap $E_1 - E_0$ over tube positions; 50% of the well_scan.' },
  snapshot: {
    version: 2,
    frozenAt: new Date('2026-11-30T14:05:00Z'),
    resultHash: '0123456789abcdef0123456789abcdef0123456789abcdef0123456789abcdef',
    solverVersion: '0.1.0+solver.1',
    gitCommit: '7908b50c1d2e3f4a5b6c7d8e9f0a1b2c3d4e5f60',
  },
  url: 'https://fluxfolio.test/snapshots/abc',
};

describe('citation', () => {
  it('key and file name', () => {
    expect(citationKey('two-flux-lines', 'gap-map', 2)).toBe('two-flux-lines:gap-map:v2');
    expect(citationKey('odd slug!', 'a_b', 1)).toBe('odd-slug:a_b:v1');
    expect(snapshotFileName('gap-map', 2)).toBe('gap-map-v2.pdf');
  });

  it('one-line citation', () => {
    expect(snapshotCitation(input)).toBe(
      'Ilse Marrow and Tomas Vey, "Bound states & two flux lines", figure gap-map v2 (snapshot frozen 2026-11-30; solver 0.1.0+solver.1 (git 7908b50), SHA-256 0123456789ab), https://fluxfolio.test/snapshots/abc',
    );
  });

  it('BibTeX @misc', () => {
    expect(snapshotBibtex(input)).toBe(
      [
        '@misc{two-flux-lines:gap-map:v2,',
        '  author       = {Ilse Marrow and Tomas Vey},',
        "  title        = {{Figure gap-map, snapshot v2, of ``Bound states \\& two flux lines''}},",
        '  year         = {2026},',
        '  month        = {11},',
        '  howpublished = {\\url{https://fluxfolio.test/snapshots/abc}},',
        '  note         = {Fluxfolio snapshot frozen 2026-11-30; solver 0.1.0+solver.1 (git 7908b50), SHA-256 0123456789ab}',
        '}',
        '',
      ].join('\n'),
    );
  });

  it('LaTeX figure block: includegraphics, caption with the snapshot citation, label', () => {
    expect(latexFigureBlock(input)).toBe(
      [
        '\\begin{figure}',
        '  \\centering',
        '  \\includegraphics[width=\\columnwidth]{gap-map-v2.pdf}',
        '  \\caption{Gap $E_1 - E_0$ over tube positions; 50\\% of the well\\_scan. (snapshot v2, \\cite{two-flux-lines:gap-map:v2})}',
        '  \\label{fig:gap-map}',
        '\\end{figure}',
        '',
      ].join('\n'),
    );
    const wide = latexFigureBlock({ ...input, figure: { ...input.figure, caption: '' } }, { width: 'two-column' });
    expect(wide).toContain('\\begin{figure*}');
    expect(wide).toContain('width=\\textwidth');
    expect(wide).toContain('\\caption{(snapshot v2, \\cite{two-flux-lines:gap-map:v2})}');
  });

  it('escaping and bad dates', () => {
    expect(latexEscape('a_b & {c} ~ ^ \\ # $')).toBe('a\\_b \\& \\{c\\} \\textasciitilde{} \\textasciicircum{} \\textbackslash{} \\# \\$');
    expect(latexCaption('keep $a_b$ but a_b')).toBe('keep $a_b$ but a\\_b');
    expect(() => snapshotCitation({ ...input, snapshot: { ...input.snapshot, frozenAt: 'not a date' } })).toThrow(/frozenAt/);
  });
});
