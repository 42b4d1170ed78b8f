import type { Config } from 'tailwindcss'

// Emberline's own palette: warm paper, ink text, one ember accent; severity hues kept for severity only.
export default {
  content: ['./components/**/*.vue', './layouts/**/*.vue', './pages/**/*.vue', './app.vue', './composables/**/*.ts'],
  theme: {
    extend: {
      fontFamily: { sans: ['"Inter Variable"', 'system-ui', 'sans-serif'] },
      colors: {
        paper: { DEFAULT: '#faf7f2', deep: '#f1ebe1', line: '#e2d9cb' },
        ink: { DEFAULT: '#1f1a17', soft: '#4a423c', mute: '#6b625a' },
        ember: { DEFAULT: '#b4410f', dark: '#8f320a', tint: '#fbe9df' },
        sev: {
          block: '#a61b1b', blockbg: '#fde8e6',
          approve: '#8a5200', approvebg: '#fdf1d8',
          clear: '#1f6b3a', clearbg: '#e3f3e8',
          note: '#2f4f79', notebg: '#e6edf6',
        },
      },
      fontSize: { xxs: ['0.6875rem', '1rem'] },
    },
  },
  plugins: [],
} satisfies Config
