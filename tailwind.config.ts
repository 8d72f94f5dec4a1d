import type { Config } from 'tailwindcss';

/**
 * Quietfix palette: deep "night sky" ink for text, a calm teal for the quiet
 * we are after, a warm amber for attention. High contrast so screens stay
 * readable outdoors in sunlight.
 */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#0f1d2b', soft: '#33475b', faint: '#5b6f82' },
        paper: { DEFAULT: '#fbfaf6', deep: '#f1efe6' },
        hush: { 50: '#eaf7f5', 100: '#c9ece7', 300: '#6cc8bb', 500: '#138a7d', 700: '#0b5e55', 900: '#06352f' },
        flare: { 100: '#fdefd5', 500: '#c8780a', 700: '#8a4f00' },
        alarm: { 100: '#fbe3e1', 600: '#b3261e', 800: '#7a140f' },
      },
      fontFamily: { sans: ['var(--font-inter)', 'system-ui', 'sans-serif'] },
    },
  },
};

export default config;
