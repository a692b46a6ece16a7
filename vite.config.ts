import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';

// In `npm run dev` the API runs on its own port and Vite proxies to it.
const apiPort = process.env.API_PORT ?? '5181';

// Answers a round or a log entry needs on a device without a network (the unit list, design and
// limits in force, the last rounds, the log's station settings and entries). NetworkFirst: while
// online every answer comes from the server; the stored copy is used only when the network fails.
// (Workbox copies each matcher's source into the worker, so each holds its pattern itself.)
export default defineConfig({
  plugins: [
    react(),
    tailwindcss(),
    // The service worker exists only in the production build (`vite build`); `npm run dev` has none.
    VitePWA({
      registerType: 'prompt',
      // Registered by src/features/offline (production only), which shows the update prompt.
      injectRegister: false,
      manifest: {
        name: 'Hotwell',
        short_name: 'Hotwell',
        description: 'Rounds, checks, shift log and handover for the condenser and cooling-water side of a steam plant',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        background_color: '#143c48',
        theme_color: '#143c48',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        // The built app shell (the page, the entry chunk and its styles, the icons) at install. Each
        // page's own chunk is kept as it is first loaded (CacheFirst below): precaching all 50-odd
        // files at once held the browser's few connections and slowed every first sign-in.
        globPatterns: ['index.html', 'manifest.webmanifest', 'icons/*.png', 'assets/index-*.{js,css}'],
        maximumFileSizeToCacheInBytes: 4 * 1024 * 1024,
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/socket\.io\//, /^\/fonts\//],
        cleanupOutdatedCaches: true,
        // The first install takes the open page at once, so the answers it fetches next are kept for offline use.
        clientsClaim: true,
        runtimeCaching: [
          {
            // Who is signed in: only as the fallback when offline; cleared on sign-out (src/features/offline).
            urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname === '/api/me',
            method: 'GET',
            handler: 'NetworkFirst',
            options: { cacheName: 'hotwell-me', cacheableResponse: { statuses: [200] } },
          },
          {
            urlPattern: ({ url, sameOrigin }) =>
              sameOrigin && /^\/api\/(plant\/units(\/\d+\/setup)?|calc\/units\/\d+\/condenser-design|units\/\d+\/(readings|log|log\/shifts|conditions))$/.test(url.pathname),
            method: 'GET',
            handler: 'NetworkFirst',
            options: {
              cacheName: 'hotwell-round-data',
              // The API says no-store to the browser's HTTP cache; this copy is the worker's own, used offline only.
              cacheableResponse: { statuses: [200] },
              expiration: { maxEntries: 200, maxAgeSeconds: 7 * 24 * 60 * 60 },
            },
          },
          {
            // Built files have their content's hash in the name: a stored copy is never stale.
            urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/assets/') && !url.pathname.endsWith('.map'),
            handler: 'CacheFirst',
            options: { cacheName: 'hotwell-assets', cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 150 } },
          },
          {
            urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/fonts/'),
            handler: 'CacheFirst',
            options: { cacheName: 'hotwell-fonts', cacheableResponse: { statuses: [200] }, expiration: { maxEntries: 20 } },
          },
        ],
      },
    }),
  ],
  build: { outDir: 'dist', emptyOutDir: true, sourcemap: true, manifest: true },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: {
      '/api': `http://127.0.0.1:${apiPort}`,
      '/fonts': `http://127.0.0.1:${apiPort}`,
      '/socket.io': { target: `http://127.0.0.1:${apiPort}`, ws: true },
    },
  },
});
