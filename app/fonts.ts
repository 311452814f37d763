import localFont from 'next/font/local';

/** Fraunces for headings, Public Sans for text: both ship in fonts/ (SIL Open Font License). */
export const displayFont = localFont({
  src: '../fonts/Fraunces-Variable.woff2',
  variable: '--font-display',
  weight: '300 800',
  display: 'swap',
});

export const textFont = localFont({
  src: [
    { path: '../fonts/PublicSans-Variable.woff2', style: 'normal', weight: '100 900' },
    { path: '../fonts/PublicSans-Variable-Italic.woff2', style: 'italic', weight: '100 900' },
  ],
  variable: '--font-text',
  display: 'swap',
});
