import type { Config } from 'tailwindcss';

// Correlary's own palette: slate ink on warm paper, a deep teal for action, amber for range warnings.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#1d2630', soft: '#4a5866', faint: '#5f6b78' },
        paper: { DEFAULT: '#faf8f4', raised: '#ffffff', sunk: '#f1ede5' },
        line: '#ddd6c9',
        brand: { DEFAULT: '#0f5f66', dark: '#0a464b', light: '#d9ecec' },
        caution: { DEFAULT: '#9a5b00', bg: '#fff4de', line: '#f0c978' },
        danger: { DEFAULT: '#a32929', bg: '#fdecec' },
        ok: { DEFAULT: '#2d6a36', bg: '#e8f4e8' },
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-mono)', 'ui-monospace', 'monospace'],
      },
    },
  },
};
export default config;
