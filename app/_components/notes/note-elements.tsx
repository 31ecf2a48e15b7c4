// Typography of rendered figure notes: the plain Markdown elements (headings, paragraphs, lists, code, links, tables)
// mapped to styled elements. Shared by the note page and the editor's preview; KaTeX output keeps its own styles.
import type { ComponentPropsWithoutRef } from 'react';

type Props<T extends keyof React.JSX.IntrinsicElements> = ComponentPropsWithoutRef<T>;

/** Styled Markdown elements for notes (no hooks: also rendered to static HTML). */
export const noteElements = {
  h1: (p: Props<'h1'>) => <h1 className="mb-4 mt-8 text-2xl font-semibold tracking-tight text-slate-900 first:mt-0" {...p} />,
  h2: (p: Props<'h2'>) => <h2 className="mb-3 mt-8 text-xl font-semibold text-slate-900" {...p} />,
  h3: (p: Props<'h3'>) => <h3 className="mb-2 mt-6 text-lg font-semibold text-slate-900" {...p} />,
  p: (p: Props<'p'>) => <p className="my-3 leading-7 text-slate-800" {...p} />,
  ul: (p: Props<'ul'>) => <ul className="my-3 list-disc space-y-1 pl-6 text-slate-800" {...p} />,
  ol: (p: Props<'ol'>) => <ol className="my-3 list-decimal space-y-1 pl-6 text-slate-800" {...p} />,
  blockquote: (p: Props<'blockquote'>) => <blockquote className="my-4 border-l-4 border-slate-300 pl-4 italic text-slate-700" {...p} />,
  a: (p: Props<'a'>) => <a className="text-flux-700 underline decoration-flux-300 underline-offset-2 hover:text-flux-900" {...p} />,
  code: (p: Props<'code'>) => <code className="rounded bg-slate-100 px-1 py-0.5 font-mono text-[0.9em] text-slate-800" {...p} />,
  pre: (p: Props<'pre'>) => <pre className="my-4 overflow-x-auto rounded-lg bg-slate-900 p-4 text-sm text-slate-100 [&_code]:bg-transparent [&_code]:text-slate-100" {...p} />,
  table: (p: Props<'table'>) => <table className="my-4 w-full border-collapse text-sm" {...p} />,
  th: (p: Props<'th'>) => <th className="border-b border-slate-300 px-2 py-1 text-left font-semibold" {...p} />,
  td: (p: Props<'td'>) => <td className="border-b border-slate-200 px-2 py-1" {...p} />,
  hr: (p: Props<'hr'>) => <hr className="my-8 border-slate-200" {...p} />,
};
