import type { Metadata, Viewport } from 'next';
import type { ReactNode } from 'react';
import { connection } from 'next/server';
import { uiFont, figuresFont } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'FadeLedger', template: '%s · FadeLedger' },
  description: 'Dish-size trade-offs against rain outages, and quotes your customers can read — for satellite installers and resellers.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#1f6f69' };

export default async function RootLayout({ children }: { children: ReactNode }) {
  // Every page renders per request: Next stamps its scripts with the nonce that proxy.ts put in
  // this request's CSP, and a page built ahead of time would carry none (and not run).
  await connection();
  return (
    <html lang="en" className={`${uiFont.variable} ${figuresFont.variable}`}>
      <body className="min-h-screen font-sans">{children}</body>
    </html>
  );
}
