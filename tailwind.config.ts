import type { Config } from 'tailwindcss';

// The engineering-notebook look of the product brief: warm paper, graphite ink, one teal
// accent, copper for secondary emphasis, red only for hard limits.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: { DEFAULT: '#f7f3ea', deep: '#efe8d8', line: '#ddd3bf' },
        // Contrast on paper #f7f3ea / paper-deep #efe8d8 / white (WCAG 2.2 relative luminance, 1.4.3
        // asks 4.5:1): ink 12.8 / 11.6 / 14.2, soft 7.2 / 6.5 / 8.0, faint 5.3 / 4.8 / 5.9.
        ink: { DEFAULT: '#2b2b2b', soft: '#555049', faint: '#6b6458' },
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
