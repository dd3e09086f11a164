import type { Config } from 'tailwindcss';

/**
 * Threadline's own palette: a deep slate-teal brand ("brand"), a cool neutral ("ink") for text
 * and rules, and plain signal hues for cautions and failures. APWA marking colours are data,
 * not theme: they come from shared/domain.ts and are applied inline to swatches.
 */
export default {
  content: ['./index.html', './src/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        brand: {
          50: '#eef6f6',
          100: '#d6e9ea',
          200: '#afd3d5',
          300: '#80b6ba',
          400: '#51939a',
          500: '#35777e',
          600: '#285f66',
          700: '#214d53',
          800: '#1c3f44',
          900: '#18343a',
          950: '#0d1f23',
        },
        ink: {
          50: '#f6f7f8',
          100: '#eceef0',
          200: '#d7dbdf',
          300: '#b6bdc4',
          400: '#8c96a0',
          500: '#6b7681',
          600: '#545e68',
          700: '#444c55',
          800: '#2f353b',
          900: '#1e2226',
        },
        caution: {
          50: '#fff8eb',
          100: '#fdecc8',
          300: '#f6c35f',
          600: '#b86e09',
          800: '#7a460c',
          900: '#5a340c',
        },
        danger: {
          50: '#fdf1f1',
          100: '#fadcdc',
          600: '#b42323',
          700: '#941c1c',
          800: '#7a1818',
        },
        ok: {
          50: '#eef8f1',
          100: '#d3efdb',
          700: '#1f6b39',
        },
      },
    },
  },
} satisfies Config;
