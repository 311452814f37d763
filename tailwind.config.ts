import type { Config } from 'tailwindcss';

/**
 * Setwell's visual identity. The palette is named after the kitchen:
 * damson (deep plum, primary), quince (warm gold, accent), pith (cream paper),
 * rind (ink neutrals), leaf (pass), ember (danger) and amberline (caution).
 */
const config: Config = {
  content: ['./app/**/*.{ts,tsx}', './components/**/*.{ts,tsx}', './lib/**/*.{ts,tsx}'],
  theme: {
    extend: {
      colors: {
        damson: {
          50: '#f7f1f5',
          100: '#ecdde7',
          200: '#d9bccf',
          300: '#bf91ae',
          400: '#9f6389',
          500: '#83466e',
          600: '#6b3459',
          700: '#572a49',
          800: '#43213a',
          900: '#2f1729',
        },
        quince: {
          50: '#fdf8ea',
          100: '#f9edc6',
          200: '#f2da8c',
          300: '#e8c153',
          400: '#d9a82e',
          500: '#b98a1c',
          600: '#936c15',
          700: '#6f5112',
        },
        pith: { 50: '#fffdf8', 100: '#fbf7ee', 200: '#f3ecdd', 300: '#e6dcc7' },
        rind: {
          300: '#b9b0a6',
          400: '#948a80',
          500: '#6f665e',
          600: '#544d47',
          700: '#3b3632',
          800: '#28241f',
          900: '#1a1714',
        },
        leaf: { 50: '#eef7ef', 100: '#d4ecd7', 600: '#2f7a43', 700: '#245f34' },
        ember: { 50: '#fdf0ee', 100: '#f9d7d1', 600: '#b2331f', 700: '#8c2616' },
        amberline: { 50: '#fff6e5', 100: '#fde7bb', 600: '#a35a00', 700: '#7d4500' },
      },
      fontFamily: {
        display: ['var(--font-display)', 'Georgia', 'serif'],
        sans: ['var(--font-text)', 'system-ui', 'sans-serif'],
      },
      fontSize: {
        // A 1.2 minor-third scale from a 15 px body size.
        xs: ['0.75rem', { lineHeight: '1.1rem' }],
        sm: ['0.8125rem', { lineHeight: '1.25rem' }],
        base: ['0.9375rem', { lineHeight: '1.5rem' }],
        lg: ['1.125rem', { lineHeight: '1.7rem' }],
        xl: ['1.35rem', { lineHeight: '1.9rem' }],
        '2xl': ['1.62rem', { lineHeight: '2.1rem' }],
        '3xl': ['1.944rem', { lineHeight: '2.4rem' }],
        '4xl': ['2.333rem', { lineHeight: '2.8rem' }],
      },
      borderRadius: { card: '0.9rem' },
      boxShadow: { card: '0 1px 2px rgb(47 23 41 / 0.06), 0 4px 16px rgb(47 23 41 / 0.05)' },
    },
  },
};

export default config;
