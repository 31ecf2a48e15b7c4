// The element map for every MDX file the app renders (required by @next/mdx at the project root):
// headings, text, links, lists, code and quotes in the Fluxfolio type scale. Later steps add figure blocks.
import type { MDXComponents } from 'mdx/types';
import Link from 'next/link';
import type { ComponentProps } from 'react';

function MdxLink({ href = '', className, ...props }: ComponentProps<'a'>) {
  const classes = 'font-medium text-flux-700 underline decoration-flux-300 underline-offset-2 hover:decoration-flux-700';
  if (href.startsWith('/') || href.startsWith('#')) return <Link href={href} className={classes} {...props} />;
  return <a href={href} className={classes} rel="noopener noreferrer" target="_blank" {...props} />;
}

export const baseMdxComponents: MDXComponents = {
  h1: (props) => <h1 className="mt-2 mb-6 text-3xl font-semibold tracking-tight text-slate-900" {...props} />,
  h2: (props) => <h2 className="mt-10 mb-4 text-2xl font-semibold tracking-tight text-slate-900" {...props} />,
  h3: (props) => <h3 className="mt-8 mb-3 text-xl font-semibold text-slate-900" {...props} />,
  h4: (props) => <h4 className="mt-6 mb-2 text-base font-semibold text-slate-900" {...props} />,
  h5: (props) => <h5 className="mt-6 mb-2 text-sm font-semibold text-slate-900" {...props} />,
  h6: (props) => <h6 className="mt-6 mb-2 text-sm font-semibold tracking-wide text-slate-600 uppercase" {...props} />,
  p: (props) => <p className="my-4 leading-7 text-slate-700" {...props} />,
  a: MdxLink,
  ul: (props) => <ul className="my-4 list-disc space-y-1 pl-6 text-slate-700" {...props} />,
  ol: (props) => <ol className="my-4 list-decimal space-y-1 pl-6 text-slate-700" {...props} />,
  li: (props) => <li className="leading-7" {...props} />,
  blockquote: (props) => <blockquote className="my-6 border-l-4 border-phase-300 pl-4 text-slate-600 italic" {...props} />,
  hr: (props) => <hr className="my-8 border-slate-200" {...props} />,
  code: (props) => <code className="rounded bg-slate-100 px-1.5 py-0.5 font-mono text-[0.9em] text-slate-800" {...props} />,
  pre: (props) => (
    <pre className="my-6 overflow-x-auto rounded-lg bg-slate-900 p-4 text-sm leading-6 text-slate-100 [&_code]:bg-transparent [&_code]:p-0 [&_code]:text-inherit" {...props} />
  ),
  table: (props) => (
    <div className="my-6 overflow-x-auto">
      <table className="w-full border-collapse text-sm" {...props} />
    </div>
  ),
  th: (props) => <th className="border-b border-slate-300 px-3 py-2 text-left font-semibold text-slate-900" {...props} />,
  td: (props) => <td className="border-b border-slate-100 px-3 py-2 text-slate-700" {...props} />,
};

export function useMDXComponents(components: MDXComponents = {}): MDXComponents {
  return { ...baseMdxComponents, ...components };
}
