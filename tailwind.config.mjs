// @ts-check
import defaultTheme from 'tailwindcss/defaultTheme';

/** Workshop palette of our own: slate-blue "steel", warm "brass" accent, "signal" for faults. */
/** @type {import('tailwindcss').Config} */
export default {
  content: ['./src/**/*.{astro,html,js,jsx,ts,tsx,md}'],
  theme: {
    extend: {
      colors: {
        steel: {
          50: '#f3f6f8', 100: '#e2e9ee', 200: '#c5d3dc', 300: '#9db3c2', 400: '#6f8da2',
          500: '#517188', 600: '#3f5a6e', 700: '#344a5a', 800: '#2c3d4a', 900: '#1e2a33', 950: '#121a20',
        },
        brass: {
          50: '#fdf8ec', 100: '#f8ecc9', 200: '#f0d68d', 300: '#e7bc55', 400: '#dea633',
          500: '#c9871f', 600: '#a96818', 700: '#874d18', 800: '#703f1a', 900: '#5e351a',
        },
        signal: { 50: '#fdf2f1', 100: '#fbe1de', 500: '#c8402f', 600: '#b03423', 700: '#8f2a1d' },
        go: { 50: '#eff8f1', 100: '#d8eedd', 500: '#2f8a4c', 600: '#23703c', 700: '#1d5a31' },
      },
      fontFamily: {
        sans: ['"Space Grotesk"', ...defaultTheme.fontFamily.sans],
      },
      minHeight: { touch: '3rem' },
      minWidth: { touch: '3rem' },
    },
  },
  plugins: [],
};
