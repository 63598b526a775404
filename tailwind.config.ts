import type { Config } from 'tailwindcss';

// Nestflow's own palette: heather (brand), straw (accent, the nest), warm paper surfaces and ink text.
// Status colours always travel with a word or icon; colour is never the only signal.
export default {
  content: ['./index.html', './web/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        brand: {
          50: '#f4f2fb',
          100: '#e6e1f5',
          200: '#cbc2ea',
          300: '#aa9edb',
          400: '#8877c8',
          500: '#6c5ab3',
          600: '#57469c',
          700: '#47387f',
          800: '#382d63',
          900: '#2a2249',
        },
        straw: {
          50: '#fdf8ec',
          100: '#faefd3',
          300: '#eecb7d',
          500: '#c9952e',
          700: '#8a6318',
          900: '#4f380b',
        },
        ink: {
          300: '#b4afc3',
          500: '#6a6580',
          700: '#3d3850',
          900: '#1e1b2a',
        },
        surface: {
          0: '#ffffff',
          50: '#faf8f5',
          100: '#f3f0ea',
          200: '#e6e1d9',
          300: '#d3ccc1',
        },
        ok: { 50: '#eaf6ef', 200: '#b9e0c8', 600: '#1f7a4a', 800: '#155535' },
        warn: { 50: '#fff5e0', 200: '#f6d79b', 600: '#a65f00', 800: '#7a4500' },
        danger: { 50: '#fdecec', 200: '#f3bcbc', 600: '#b42323', 800: '#861717' },
      },
      fontFamily: {
        sans: ['"Nunito Sans"', 'ui-sans-serif', 'system-ui', 'sans-serif'],
      },
    },
  },
} satisfies Config;
