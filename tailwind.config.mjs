/** Kerfline palette: warm wood and ink tones, plus one signal colour for cautions. */
/** @type {import('tailwindcss').Config} */
export default {
  content: ['./src/**/*.{astro,html,js,jsx,ts,tsx,md}'],
  theme: {
    extend: {
      colors: {
        ink: { DEFAULT: '#1f2328', soft: '#4b5259', faint: '#8a9096' },
        paper: { DEFAULT: '#fbfaf7', shade: '#f1eee7', line: '#d9d4c8' },
        spruce: { DEFAULT: '#2f5d50', dark: '#234539', light: '#e3eeea' },
        rosewood: { DEFAULT: '#7a3b2e', light: '#f5e6e2' },
        caution: { DEFAULT: '#8a5a00', light: '#fff4d6' },
      },
      fontFamily: {
        mono: ['"JetBrains Mono"', 'ui-monospace', 'monospace'],
        sans: ['system-ui', '-apple-system', '"Segoe UI"', 'Roboto', 'sans-serif'],
      },
    },
  },
  plugins: [],
};
