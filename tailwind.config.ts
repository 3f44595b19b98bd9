import type { Config } from 'tailwindcss';

/** Browseline's design tokens (DESIGN.md): a field notebook's paper, ink, moss, ochre, clay, sky. */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        paper: '#F6F3EA',
        card: '#FFFDF7',
        rule: '#D9D3C3',
        ink: '#1F2A24',
        slate: '#5B6770',
        moss: { DEFAULT: '#3F6B3A', deep: '#2E5029' },
        ochre: '#C99A2E',
        clay: '#B5562B',
        sky: '#3C7A9E',
      },
      fontFamily: {
        serif: ['Merriweather', 'Georgia', 'serif'],
        sans: ['"Source Sans 3"', 'system-ui', 'sans-serif'],
      },
      borderRadius: { DEFAULT: '5px' },
    },
  },
} satisfies Config;
