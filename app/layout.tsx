import type { Metadata } from 'next';
import type { ReactNode } from 'react';
import { Providers } from '@/components/providers';
import { SiteFooter } from '@/components/site-footer';
import { SiteHeader } from '@/components/site-header';
import { plexMono, publicSans } from './fonts';
import './globals.css';

export const metadata: Metadata = {
  title: { default: 'Trailbench — measured gear tests', template: '%s · Trailbench' },
  description:
    'A journal of measured field tests of lights, power banks, 12 V batteries, solar panels and radios, compared by value.',
};

export default function RootLayout({ children }: { children: ReactNode }) {
  return (
    <html lang="en" className={`${publicSans.variable} ${plexMono.variable}`}>
      <body className="flex min-h-screen flex-col bg-paper text-ink antialiased">
        <Providers>
          <SiteHeader />
          <div id="main" className="flex-1">
            {children}
          </div>
          <SiteFooter />
        </Providers>
      </body>
    </html>
  );
}
