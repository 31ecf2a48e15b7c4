// Tailwind theme for Fluxfolio, read by Tailwind 4 through the `@config` line in app/globals.css.
// Colours: a deep "flux" indigo for actions and a warm "phase" amber for highlights; neutral slate text.
import type { Config } from 'tailwindcss';

const config: Config = {
  content: ['./app/**/*.{ts,tsx,mdx}', './content/**/*.mdx', './mdx-components.tsx', './lib/**/*.ts'],
  theme: {
    extend: {
      colors: {
        flux: {
          50: '#eef2ff', 100: '#e0e7ff', 200: '#c7d2fe', 300: '#a5b4fc', 400: '#818cf8',
          500: '#6366f1', 600: '#4f46e5', 700: '#4338ca', 800: '#3730a3', 900: '#312e81',
        },
        phase: { 100: '#fef3c7', 300: '#fcd34d', 500: '#f59e0b', 700: '#b45309' },
      },
      fontFamily: { sans: ['var(--font-inter)', 'ui-sans-serif', 'system-ui', 'sans-serif'] },
    },
  },
};

export default config;
