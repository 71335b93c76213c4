import type { Metadata, Viewport } from 'next';
import { headers } from 'next/headers';
import './globals.css';
import { sans, display } from './fonts';
import { SiteHeader } from '@/components/site-header';
import { ServiceWorker } from '@/components/offline/service-worker';
import { OfflineBanner } from '@/components/offline/offline-banner';
import { OfflineSync } from '@/components/offline/offline-sync';
import { getCurrentUser } from '@/lib/auth/session';

export const metadata: Metadata = {
  title: { default: 'Candlewise', template: '%s · Candlewise' },
  description: 'Shoot-by-shoot advice, a curated species knowledge base and a club record for growers of pines and other conifers.',
};

export const viewport: Viewport = { width: 'device-width', initialScale: 1, themeColor: '#33522c' };

export default async function RootLayout({ children }: { children: React.ReactNode }) {
  // Reading the request makes every page render per request, so each gets the nonce that
  // proxy.ts put in its policy (Next adds it to its own scripts).
  await headers();
  const user = await getCurrentUser();
  return (
    <html lang="en" className={`${sans.variable} ${display.variable}`}>
      <body className="min-h-screen">
        <ServiceWorker>
          <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:p-2">
            Skip to content
          </a>
          <SiteHeader />
          <OfflineBanner />
          <OfflineSync userId={user?.id ?? null} />
          <main id="main" className="mx-auto w-full max-w-5xl px-4 py-6 sm:py-10">
            {children}
          </main>
          <footer className="no-print mx-auto max-w-5xl px-4 pb-8 text-sm text-stone-600">
            Candlewise gives general guidance. Follow fertiliser labels and your local rules on collecting, planting out and chemicals.
          </footer>
        </ServiceWorker>
      </body>
    </html>
  );
}
