import type { Metadata, Viewport } from 'next';
import localFont from 'next/font/local';
import { connection } from 'next/server';
import './globals.css';
import { ServiceWorkerRegistrar } from '@/components/field/service-worker-registrar';

// Shipped with the app from the @fontsource-variable/inter package: nothing is fetched at build or run time.
const inter = localFont({
  src: [
    { path: '../node_modules/@fontsource-variable/inter/files/inter-latin-wght-normal.woff2', style: 'normal', weight: '100 900' },
    { path: '../node_modules/@fontsource-variable/inter/files/inter-latin-wght-italic.woff2', style: 'italic', weight: '100 900' },
  ],
  variable: '--font-inter',
  display: 'swap',
});

export const metadata: Metadata = {
  title: { default: 'Quietfix', template: '%s · Quietfix' },
  description: 'Find the device that spoils your reception, and get it fixed politely.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#0b5e55' };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Every page renders per request so Next can put the CSP nonce from proxy.ts on its scripts.
  await connection();
  return (
    <html lang="en" className={inter.variable}>
      <body className="min-h-dvh font-sans">
        {children}
        <ServiceWorkerRegistrar />
      </body>
    </html>
  );
}
