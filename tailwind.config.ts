import type { Config } from 'tailwindcss';

// Design tokens for Candlewise: a calm palette of moss, bark and stone,
// a modular type scale (1.2) and a 4 px spacing rhythm.
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        moss: {
          50: '#f3f7f1',
          100: '#e2ecdc',
          200: '#c4d9ba',
          300: '#9dbf8e',
          400: '#74a064',
          500: '#548347',
          600: '#406836',
          700: '#33522c',
          800: '#2a4226',
          900: '#233721',
        },
        bark: {
          50: '#f8f5f1',
          100: '#ede6dc',
          200: '#dacbb7',
          300: '#c2a98b',
          400: '#a98766',
          500: '#8f6d4e',
          600: '#74573f',
          700: '#5c4533',
          800: '#4a382b',
          900: '#3d2f25',
        },
        stone: {
          50: '#f7f7f5',
          100: '#eeeeea',
          200: '#dcdcd5',
          300: '#c2c2b8',
          400: '#9a9a8e',
          500: '#76766b',
          600: '#5c5c53',
          700: '#484842',
          800: '#33332f',
          900: '#1f1f1c',
        },
        clay: { 100: '#fbe9e3', 500: '#b4532f', 700: '#8a3b1f' },
        sun: { 100: '#fdf4d8', 500: '#c99a17', 700: '#7a5c08' },
      },
      fontFamily: {
        sans: ['var(--font-sans)', 'system-ui', 'sans-serif'],
        display: ['var(--font-display)', 'Georgia', 'serif'],
      },
      fontSize: {
        xs: ['0.75rem', { lineHeight: '1.1rem' }],
        sm: ['0.875rem', { lineHeight: '1.3rem' }],
        base: ['1rem', { lineHeight: '1.6rem' }],
        lg: ['1.2rem', { lineHeight: '1.8rem' }],
        xl: ['1.44rem', { lineHeight: '2rem' }],
        '2xl': ['1.728rem', { lineHeight: '2.3rem' }],
        '3xl': ['2.074rem', { lineHeight: '2.6rem' }],
        '4xl': ['2.488rem', { lineHeight: '3rem' }],
      },
      spacing: { 18: '4.5rem', 22: '5.5rem' },
      borderRadius: { card: '0.75rem' },
      minHeight: { target: '2.75rem' },
      minWidth: { target: '2.75rem' },
    },
  },
};

export default config;
