import type { MetadataRoute } from 'next';

// The web app manifest: what a phone needs to install Candlewise and open it at the wizard.
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: '/',
    name: 'Candlewise',
    short_name: 'Candlewise',
    description: 'Shoot-by-shoot advice for pines and other conifers, in the garden, with or without a signal.',
    start_url: '/ask',
    scope: '/',
    display: 'standalone',
    background_color: '#f7f5f0',
    theme_color: '#33522c',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  };
}
