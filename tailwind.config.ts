import type { Config } from 'tailwindcss';
import { PALETTE_TOKENS } from './shared/palette';

// The "site notebook" palette, from the tokens the PDFs and the editor's canvas read too.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: PALETTE_TOKENS,
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
      },
    },
  },
} satisfies Config;
