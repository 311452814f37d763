import localFont from 'next/font/local';

/**
 * Fraunces for headings, Public Sans for text: both ship in fonts/ (SIL Open Font License).
 * Not preloaded: the three files (~90 kB) would be fetched on every first visit in competition
 * with the stylesheet and the HTML, which on a slow phone network delays the first paint by
 * seconds; with `swap` the text paints at once in the fallback face and changes when a face arrives.
 */
export const displayFont = localFont({
  src: '../fonts/Fraunces-Variable.woff2',
  variable: '--font-display',
  weight: '300 800',
  display: 'swap',
  preload: false,
});

export const textFont = localFont({
  src: [
    { path: '../fonts/PublicSans-Variable.woff2', style: 'normal', weight: '100 900' },
    { path: '../fonts/PublicSans-Variable-Italic.woff2', style: 'italic', weight: '100 900' },
  ],
  variable: '--font-text',
  display: 'swap',
  preload: false,
});
