import type { Metadata } from 'next';
import './globals.css';
import { uiFont, figuresFont } from './fonts';
import { Providers } from '@/components/providers';

export const metadata: Metadata = {
  title: { default: 'Needlemap', template: '%s · Needlemap' },
  description: 'Knit-texture zoning, yarn, content and fit for knitted performance garments.',
};

export default function RootLayout({ children }: { children: React.ReactNode }) {
  return (
    <html lang="en" className={`${uiFont.variable} ${figuresFont.variable}`}>
      <body className="min-h-screen font-sans text-[14px] leading-5">
        <Providers>{children}</Providers>
      </body>
    </html>
  );
}
