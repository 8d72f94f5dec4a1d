import type { MetadataRoute } from 'next';

/** The installable field app (served as /manifest.webmanifest): our own mark and the hush/paper colours. */
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: '/cases',
    name: 'Quietfix — noise hunting in the field',
    short_name: 'Quietfix',
    description: 'Bearings, level walks and cases for your club’s interference committee, also without a connection.',
    start_url: '/cases',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    background_color: '#fbfaf6',
    theme_color: '#0b5e55',
    icons: [
      { src: '/field-icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
      { src: '/field-icon-maskable.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'maskable' },
    ],
  };
}
