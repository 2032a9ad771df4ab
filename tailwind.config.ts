import type { Config } from 'tailwindcss'

// A calm, professional palette of our own: slate ink, a deep teal for actions, amber for cautions.
export default {
  content: [
    './components/**/*.{vue,ts}',
    './layouts/**/*.vue',
    './pages/**/*.vue',
    './app.vue',
    './error.vue',
    './composables/**/*.ts',
    './shared/report/**/*.ts',
  ],
  theme: {
    extend: {
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
        serif: ['Merriweather', 'Georgia', 'serif'],
      },
      colors: {
        ink: { 50: '#f6f7f9', 100: '#eceef2', 200: '#d5d9e2', 300: '#b0b8c9', 400: '#8591aa', 500: '#5a6580', 600: '#515b76', 700: '#434a60', 800: '#3a4051', 900: '#2a2e3a', 950: '#1b1e26' },
        tide: { 50: '#effaf9', 100: '#d7f1ef', 200: '#b2e3e0', 300: '#7fcdca', 400: '#4cb0ae', 500: '#329493', 600: '#277677', 700: '#245f61', 800: '#214d4f', 900: '#1f4143', 950: '#0d2628' },
        ember: { 50: '#fff8eb', 100: '#feeac7', 200: '#fdd38a', 300: '#fcb54d', 400: '#fb9a24', 500: '#f5780b', 600: '#d95406', 700: '#b43909', 800: '#922c0e', 900: '#78250f' },
      },
    },
  },
  plugins: [],
} satisfies Config
