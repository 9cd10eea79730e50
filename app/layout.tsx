import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { uiFont, figuresFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'FadeLedger', template: '%s · FadeLedger' },
  description: 'Dish-size trade-offs against rain outages, and quotes your customers can read — for satellite installers and resellers.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#1f6f69' };

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${uiFont.variable} ${figuresFont.variable}`}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
