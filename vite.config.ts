import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import { VitePWA } from 'vite-plugin-pwa';

// The proxy keeps the browser's Origin and Host; the API accepts writes from APP_URL's
// origin, which npm run dev sets to this dev server (http://127.0.0.1:5173).
const apiProxy = {
  '/api': { target: 'http://127.0.0.1:3000', changeOrigin: false },
};

export default defineConfig({
  // Path aliases (@/, @shared/, @server/, @db/) come from tsconfig.json's paths.
  resolve: { tsconfigPaths: true },
  plugins: [
    react(),
    // Installs as an app on a phone and opens without signal. The service worker keeps only
    // the app shell and the hashed static files; /api always goes to the network (the
    // data a member has opened comes from TanStack Query's cache saved on the device).
    // Not in `npm run dev` (devOptions off): hot reload stays as it was.
    VitePWA({
      registerType: 'autoUpdate',
      injectRegister: 'script-defer',
      includeAssets: ['icons/apple-touch-icon.png'],
      manifest: {
        name: 'Headroom',
        short_name: 'Headroom',
        description: 'Plan, track and prove a diesel pickup power build.',
        start_url: '/builds',
        scope: '/',
        display: 'standalone',
        background_color: '#f6f3ec',
        theme_color: '#1b2230',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          {
            src: '/icons/icon-maskable-512.png',
            sizes: '512x512',
            type: 'image/png',
            purpose: 'maskable',
          },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff,woff2,png,svg,webmanifest}'],
        navigateFallback: '/index.html',
        // The API, the mail catcher and the calendar feeds are never answered by the worker.
        navigateFallbackDenylist: [/^\/api\//, /^\/dev\//],
        runtimeCaching: [],
        cleanupOutdatedCaches: true,
        // The first visit's page is controlled at once: it can lose signal before any reload.
        clientsClaim: true,
      },
    }),
  ],
  build: { outDir: 'dist', emptyOutDir: true },
  server: { proxy: apiProxy },
  preview: { proxy: apiProxy },
});
