import type { Config } from 'tailwindcss';

// Patchwise's own palette: field greens, straw and soil neutrals, one warm accent for patches,
// and a single-hue ramp (density) for surfaces on the map.
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Work Sans"', 'system-ui', 'sans-serif'] },
      colors: {
        field: {
          50: '#f1f7ef',
          100: '#dcebd6',
          200: '#b9d7ad',
          300: '#8fbd7e',
          400: '#659f56',
          500: '#47823b',
          600: '#37682e',
          700: '#2f5d3a',
          800: '#244229',
          900: '#1a3020',
        },
        straw: { 50: '#fbf8f0', 100: '#f5eedb', 200: '#ebdcb4', 300: '#dfc585', 400: '#d3ad5c', 500: '#c4953f' },
        soil: { 300: '#b9aa98', 400: '#9a8670', 500: '#7c6a55', 600: '#5f5142', 700: '#4a3f34', 800: '#352d25', 900: '#241e19' },
        patch: { 50: '#fff3ec', 100: '#ffe0cc', 400: '#f08a4b', 500: '#e06a26', 600: '#c2531a', 700: '#9a3f14' },
        density: { 1: '#eef4e4', 2: '#cfe1b5', 3: '#a9cb84', 4: '#7fae57', 5: '#578d35', 6: '#376b20', 7: '#1f4a10' },
      },
    },
  },
  plugins: [],
} satisfies Config;
