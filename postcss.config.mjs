// PostCSS pipeline: Tailwind 4 only.
export default { plugins: { '@tailwindcss/postcss': {} } };
