import type { Metadata, Viewport } from 'next';
import { displayFont, textFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Setwell', template: '%s · Setwell' },
  description: 'The development notebook for fruit-preserve makers.',
  icons: { icon: '/setwell-mark.svg' },
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#43213a' };

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${displayFont.variable} ${textFont.variable}`}>
      <body className="min-h-screen">{children}</body>
    </html>
  );
}
