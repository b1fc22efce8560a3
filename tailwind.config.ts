import type { Config } from 'tailwindcss';

// The "site notebook" palette.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#faf7f0', dark: '#f1ecdf', line: '#e7e0cf' },
        graphite: { DEFAULT: '#33363b', light: '#5b6068', faint: '#9aa0a8' },
        timber: { DEFAULT: '#8a5a2b', light: '#b88a5a' },
        straw: { DEFAULT: '#e2b94b', light: '#f3dc93', dark: '#a57e16' },
        teal: { DEFAULT: '#1f8a84', light: '#9fd6d1', dark: '#135e5a' },
        brick: { DEFAULT: '#b0462f', light: '#e8b4a6', dark: '#7c2d1d' },
        sky: { DEFAULT: '#a9d4ef', light: '#dceefa', dark: '#3d86b8' },
      },
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
    },
  },
} satisfies Config;
