import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

const apiPort = Number(process.env.PORT ?? 3000);
const webPort = Number(process.env.WEB_PORT ?? 5173);

/**
 * Installable app: the manifest, and a service worker that keeps the app shell and fonts
 * (precached), the tiles viewed, and the GET reads the field screens need with no signal: the
 * session, the project list and one project with its lines, bores and holes (and one hole with
 * its photos). Reads go to the network first; the last answer is used only when there is no
 * network. Writes are never cached (the outbox keeps those); the read cache is emptied on
 * sign-out. The URL patterns sit inside the functions because Workbox copies the functions'
 * text into the service worker.
 */
const pwa = VitePWA({
  registerType: 'autoUpdate',
  injectRegister: 'script',
  includeAssets: ['icons/*.png'],
  manifest: {
    name: 'Threadline',
    short_name: 'Threadline',
    description: 'Register of buried lines, test holes and proposed bores, with computed clearances.',
    start_url: '/projects',
    scope: '/',
    display: 'standalone',
    background_color: '#f7f8f8',
    theme_color: '#1f4d53',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
      { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
    ],
  },
  workbox: {
    globPatterns: ['**/*.{js,css,html,woff2,png,svg}'],
    navigateFallback: '/index.html',
    navigateFallbackDenylist: [/^\/api\//],
    cleanupOutdatedCaches: true,
    runtimeCaching: [
      {
        urlPattern: ({ url, sameOrigin }) => sameOrigin && /^\/api\/projects\/\d+\/tiles\/\d+\/\d+\/\d+\.png$/.test(url.pathname),
        handler: 'StaleWhileRevalidate',
        options: { cacheName: 'tl-tiles', expiration: { maxEntries: 3000 }, cacheableResponse: { statuses: [200] } },
      },
      {
        urlPattern: ({ url, sameOrigin }) =>
          sameOrigin && /^\/api\/(auth\/me|projects(\/\d+(\/(lines|bores|holes|tiles)|\/holes\/\d+(\/photos)?)?)?)$/.test(url.pathname),
        handler: 'NetworkFirst',
        options: { cacheName: 'tl-api', cacheableResponse: { statuses: [200] } },
      },
    ],
  },
});

export default defineConfig({
  plugins: [react(), tailwindcss(), pwa],
  resolve: { tsconfigPaths: true },
  server: { port: webPort, strictPort: true, proxy: { '/api': `http://127.0.0.1:${apiPort}` } },
  build: { outDir: 'dist', chunkSizeWarningLimit: 400 },
  test: {
    environment: 'node',
    include: ['tests/**/*.test.ts'],
    testTimeout: 20000,
    hookTimeout: 30000,
  },
});
