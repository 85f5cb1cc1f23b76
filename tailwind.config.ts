import type { Config } from 'tailwindcss';

/**
 * Seepwise's visual identity, set once: warm earth and leaf. Terracotta is the accent; sage is
 * always "olla" and slate blue always "surface" (in charts too, always with a label beside).
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        terracotta: { 50: '#fbf1eb', 100: '#f5dccd', 200: '#eab89b', 300: '#dc8e66', 400: '#cc6c40', 500: '#b5562f', 600: '#9a4525', 700: '#7c3820', 800: '#5e2b1a', 900: '#3f1d12' },
        sage: { 50: '#f1f6ef', 100: '#dde9d8', 200: '#bcd3b3', 300: '#97b98a', 400: '#739d66', 500: '#5a8a4f', 600: '#476f3e', 700: '#3a5a33', 800: '#2d4628', 900: '#1f301c' },
        slate: { 50: '#eef3f8', 100: '#d9e3ee', 200: '#b3c7dd', 300: '#87a5c7', 400: '#5d83ae', 500: '#3b5f8a', 600: '#304e72', 700: '#273f5c', 800: '#1d2f45', 900: '#141f2e' },
        sand: { 50: '#fdfaf5', 100: '#f6efe4', 200: '#ede1cd', 300: '#dfcbaa', 400: '#c9ab7f', 500: '#a98a5d', 600: '#8a6f48', 700: '#6b5637', 800: '#4a3c27', 900: '#2e2518' },
        ink: { DEFAULT: '#2b241d', muted: '#5f5448', faint: '#8a7d6e' },
        olla: '#4a7642',
        surface: '#3b5f8a',
      },
      fontFamily: {
        sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        // A calm type scale: 1.2 ratio from 16 px.
        xs: ['0.75rem', { lineHeight: '1.1rem' }],
        sm: ['0.875rem', { lineHeight: '1.3rem' }],
        base: ['1rem', { lineHeight: '1.55rem' }],
        lg: ['1.2rem', { lineHeight: '1.7rem' }],
        xl: ['1.44rem', { lineHeight: '1.9rem' }],
        '2xl': ['1.728rem', { lineHeight: '2.2rem' }],
        '3xl': ['2.074rem', { lineHeight: '2.5rem' }],
      },
      borderRadius: { card: '0.75rem' },
    },
  },
} satisfies Config;
