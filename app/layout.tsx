import type { Metadata, Viewport } from 'next';
import { connection } from 'next/server';
import { displayFont, textFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Setwell', template: '%s · Setwell' },
  description: 'The development notebook for fruit-preserve makers.',
  icons: { icon: '/setwell-mark.svg' },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#43213a' };

/**
 * Every page renders per request: Next.js can only put the Content-Security-Policy nonce from
 * proxy.ts on its script tags at request time, and a prerendered page's scripts would be blocked.
 */
export default async function RootLayout({ children }: { children: React.ReactNode }) {
  await connection();
  return (
    <html lang="en" className={`${displayFont.variable} ${textFont.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
