// Citation strings for a frozen snapshot: a one-line citation, a BibTeX @misc entry and a ready LaTeX figure block that
// includes the exported PDF and cites the snapshot. Pure string building; the stable URL is passed in by the caller.
import type { FigureWidth } from '@/lib/export/widths';

/** What a citation needs to know about a snapshot. */
export interface SnapshotCitationInput {
  manuscript: { slug: string; title: string; authors: string[] };
  figure: { label: string; caption: string };
  snapshot: {
    version: number;
    frozenAt: Date | string;
    resultHash: string;
    solverVersion: string;
    gitCommit?: string | null;
    /** Name of the person who froze it (optional; shown in the one-line citation). */
    frozenBy?: string | null;
  };
  /** The snapshot's stable URL (absolute). */
  url: string;
}

/** Length of the hash prefix quoted in citations (12 hex digits = 48 bits, common practice for short content ids). */
export const HASH_PREFIX_LENGTH = 12;

function isoDate(value: Date | string): string {
  const d = value instanceof Date ? value : new Date(value);
  if (Number.isNaN(d.getTime())) throw new RangeError(`frozenAt must be a date, got ${JSON.stringify(value)}`);
  return d.toISOString().slice(0, 10);
}

/**
 * The BibTeX key of a snapshot: manuscript slug, figure label and version, with characters outside [A-Za-z0-9_-] replaced
 * by dashes so that every BibTeX implementation accepts it.
 *
 * @example citationKey('ring-well-2026', 'gap-map', 2) // returns 'ring-well-2026:gap-map:v2'
 */
export function citationKey(slug: string, label: string, version: number): string {
  const clean = (s: string) => s.replace(/[^A-Za-z0-9_-]+/g, '-').replace(/^-+|-+$/g, '') || 'x';
  return `${clean(slug)}:${clean(label)}:v${version}`;
}

/** The file name of a snapshot's exported graphic (PDF by default), as \includegraphics uses it. */
export function snapshotFileName(label: string, version: number, extension = 'pdf'): string {
  return `${label}-v${version}.${extension}`;
}

/** Escape text for LaTeX/BibTeX outside math: \ { } & % $ # _ ~ ^. */
export function latexEscape(text: string): string {
  return text.replace(/[\\{}&%$#_~^]/g, (c) => {
    switch (c) {
      case '\\':
        return '\\textbackslash{}';
      case '~':
        return '\\textasciitilde{}';
      case '^':
        return '\\textasciicircum{}';
      default:
        return `\\${c}`;
    }
  });
}

/**
 * Escape a caption for LaTeX while keeping the author's inline math ($…$) and commands: outside math only the characters
 * that would break compilation as plain text (& % # _ ~ ^) are escaped.
 */
export function latexCaption(caption: string): string {
  const parts = caption.split(/(\$[^$]*\$)/g);
  return parts
    .map((part) => (part.startsWith('$') && part.endsWith('$') && part.length >= 2 ? part : part.replace(/[&%#_~^]/g, (c) => {
      if (c === '~') return '\\textasciitilde{}';
      if (c === '^') return '\\textasciicircum{}';
      return `\\${c}`;
    })))
    .join('');
}

function authorList(authors: string[]): string {
  if (authors.length === 0) return '';
  if (authors.length === 1) return authors[0];
  if (authors.length === 2) return `${authors[0]} and ${authors[1]}`;
  return `${authors.slice(0, -1).join(', ')}, and ${authors[authors.length - 1]}`;
}

function solverNote(s: SnapshotCitationInput['snapshot']): string {
  const commit = s.gitCommit ? ` (git ${s.gitCommit.slice(0, 7)})` : '';
  return `solver ${s.solverVersion}${commit}, SHA-256 ${s.resultHash.slice(0, HASH_PREFIX_LENGTH)}`;
}

/**
 * One-line citation of a snapshot, in plain text.
 *
 * @example
 * snapshotCitation(input)
 * // returns 'A. Ferrand and B. Osei, "Bound states around two flux lines", figure gap-map v2 (snapshot frozen 2026-12-01;
 * //          solver 0.1.0+solver.1, SHA-256 0123456789ab), https://fluxfolio.example/s/…'
 */
export function snapshotCitation(input: SnapshotCitationInput): string {
  const { manuscript, figure, snapshot, url } = input;
  const who = authorList(manuscript.authors);
  const lead = who ? `${who}, ` : '';
  return `${lead}"${manuscript.title}", figure ${figure.label} v${snapshot.version} (snapshot frozen ${isoDate(snapshot.frozenAt)}; ${solverNote(snapshot)}), ${url}`;
}

/**
 * A BibTeX @misc entry for a snapshot: key from slug, label and version; `howpublished` is the stable URL; `note` holds the
 * solver version and the hash prefix.
 *
 * @example snapshotBibtex(input).split('\n')[0] // returns '@misc{ring-well-2026:gap-map:v2,'
 */
export function snapshotBibtex(input: SnapshotCitationInput): string {
  const { manuscript, figure, snapshot, url } = input;
  const frozen = isoDate(snapshot.frozenAt);
  const fields: [string, string][] = [];
  if (manuscript.authors.length > 0) fields.push(['author', manuscript.authors.map(latexEscape).join(' and ')]);
  fields.push(['title', `{Figure ${latexEscape(figure.label)}, snapshot v${snapshot.version}, of \`\`${latexEscape(manuscript.title)}''}`]);
  fields.push(['year', frozen.slice(0, 4)]);
  fields.push(['month', String(Number(frozen.slice(5, 7)))]);
  fields.push(['howpublished', `\\url{${url.replace(/[{}\\]/g, '')}}`]);
  fields.push(['note', `Fluxfolio snapshot frozen ${frozen}; ${latexEscape(solverNote(snapshot))}`]);
  const body = fields.map(([k, v]) => `  ${k.padEnd(12)} = {${v}}`).join(',\n');
  return `@misc{${citationKey(manuscript.slug, figure.label, snapshot.version)},\n${body}\n}\n`;
}

/**
 * A LaTeX figure block that includes `<label>-v<version>.pdf`, captions it with the snapshot citation and labels it
 * `fig:<label>`. Two-column figures use `figure*` and `\textwidth`.
 *
 * @example
 * latexFigureBlock(input)
 * // returns '\\begin{figure}\n  \\centering\n  \\includegraphics[width=\\columnwidth]{gap-map-v2.pdf}\n  \\caption{… (snapshot v2, \\cite{…})}\n  \\label{fig:gap-map}\n\\end{figure}\n'
 */
export function latexFigureBlock(input: SnapshotCitationInput, options: { width?: FigureWidth } = {}): string {
  const { manuscript, figure, snapshot } = input;
  const wide = options.width === 'two-column';
  const env = wide ? 'figure*' : 'figure';
  const key = citationKey(manuscript.slug, figure.label, snapshot.version);
  const caption = figure.caption.trim() ? `${latexCaption(figure.caption.trim())} ` : '';
  return [
    `\\begin{${env}}`,
    '  \\centering',
    `  \\includegraphics[width=${wide ? '\\textwidth' : '\\columnwidth'}]{${snapshotFileName(figure.label, snapshot.version)}}`,
    `  \\caption{${caption}(snapshot v${snapshot.version}, \\cite{${key}})}`,
    `  \\label{fig:${figure.label}}`,
    `\\end{${env}}`,
    '',
  ].join('\n');
}
