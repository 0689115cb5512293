import type { Config } from 'tailwindcss';

// The engineering-notebook look of the product brief: warm paper, graphite ink, one teal
// accent, copper for secondary emphasis, red only for hard limits.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f3ea', deep: '#efe8d8', line: '#ddd3bf' },
        ink: { DEFAULT: '#2b2b2b', soft: '#555049', faint: '#8a8377' },
        teal: { DEFAULT: '#0f766e', dark: '#115e59', light: '#ccebe7' },
        copper: { DEFAULT: '#b4632b', light: '#f3dfcf' },
        limit: { DEFAULT: '#b91c1c', light: '#fbe3e3' },
      },
      fontFamily: {
        sans: ['"Roboto Flex"', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
