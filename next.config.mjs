// Next.js configuration: MDX pages (with KaTeX math) and the server-only packages kept out of the bundle.
// Plugins are named as strings so that Turbopack can serialise them.
import createMDX from '@next/mdx';

const withMDX = createMDX({
  extension: /\.mdx?$/,
  options: { remarkPlugins: ['remark-math'], rehypePlugins: ['rehype-katex'] },
});

/** @type {import('next').NextConfig} */
const nextConfig = {
  pageExtensions: ['ts', 'tsx', 'md', 'mdx'],
  serverExternalPackages: ['@resvg/resvg-js', 'pg-boss', 'mathjs', 'pngjs', 'pdfkit', 'svg-to-pdfkit'],
  poweredByHeader: false,
};

export default withMDX(nextConfig);
