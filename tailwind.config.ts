import type { Config } from 'tailwindcss';

// One accent colour (a deep teal we call "ledger"), calm neutrals, tabular numbers.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ledger: {
          50: '#eef8f7',
          100: '#d5eeeb',
          200: '#a9dcd6',
          300: '#74c3bb',
          400: '#45a69d',
          500: '#2b8a82',
          600: '#1f6f69',
          700: '#1b5955',
          800: '#184845',
          900: '#143b39',
        },
      },
      fontFamily: {
        sans: ['var(--font-ui)', 'system-ui', 'sans-serif'],
        mono: ['var(--font-figures)', 'ui-monospace', 'monospace'],
      },
    },
  },
};

export default config;
