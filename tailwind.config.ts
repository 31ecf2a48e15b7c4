// Tailwind configuration for Fluxfolio, read by Tailwind 4 through the `@config` line in app/globals.css.
// The colours and fonts are design tokens in app/globals.css (`@theme`); this file only says where classes are used.
import type { Config } from 'tailwindcss';

const config: Config = {
  content: ['./app/**/*.{ts,tsx,mdx}', './content/**/*.mdx', './mdx-components.tsx', './lib/**/*.ts'],
};

export default config;
