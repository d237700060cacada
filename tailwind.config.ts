import type { Config } from 'tailwindcss';

/**
 * Conductory's own palette: a patina green for structure, a warm copper for action, on a paper
 * white; numbers set in Roboto Flex with tabular figures.
 */
export default {
  content: ['./index.html', './frontend/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: {
        sans: ['"Roboto Flex Variable"', 'system-ui', 'sans-serif'],
      },
      colors: {
        paper: '#f7f5f0',
        ink: '#1d2421',
        patina: {
          50: '#eef6f4',
          100: '#d5ebe6',
          300: '#8cc5b8',
          500: '#2f8a79',
          700: '#1d5c51',
          900: '#12372f',
        },
        copper: {
          100: '#f8e6d8',
          300: '#e3a677',
          // 5.5:1 under white text and 5.1:1 as text on paper (WCAG AA asks 4.5:1); the first
          // copper, #b8642e, gave white button labels only 4.3:1.
          500: '#a15424',
          700: '#8a4519',
        },
      },
    },
  },
} satisfies Config;
