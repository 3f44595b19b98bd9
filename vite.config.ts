import path from 'node:path';
import { defineConfig, type Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { VitePWA } from 'vite-plugin-pwa';
import { precompressAssets } from './server/scripts/build/vite-precompress';
import { shellFiles } from './server/scripts/build/bundle-budgets';

const root = import.meta.dirname;
const outDir = 'dist';

/** In development, every page but sign-in is the app (src/app.html), as the server does in production. */
function appPagesInDev(): Plugin {
  return {
    name: 'browseline-app-pages',
    apply: 'serve',
    configureServer(server) {
      server.middlewares.use((req, _res, next) => {
        const url = req.url ?? '/';
        const isPage = req.method === 'GET' && (req.headers.accept ?? '').includes('text/html') && !/^\/(@|src\/|node_modules\/|api\/|login(\?|$)|index\.html)/.test(url);
        if (isPage) req.url = '/src/app.html';
        else if (req.method === 'GET' && /^\/login(\?|$)/.test(url)) req.url = `/index.html${url.slice('/login'.length)}`;
        next();
      });
    },
  };
}

// The client: two pages built to dist/ and served by Express — index.html is the small sign-in page,
// src/app.html the app (every other address). In development `vite` proxies /api to the server.
export default defineConfig({
  appType: 'mpa',
  plugins: [
    react(),
    tailwindcss(),
    appPagesInDev(),
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      includeAssets: ['favicon.svg'],
      manifest: {
        name: 'Browseline',
        short_name: 'Browseline',
        description: 'Habitat plans, the crew’s field sheet and the landowner’s portal.',
        lang: 'en',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        theme_color: '#3F6B3A',
        background_color: '#F6F3EA',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
          { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml' },
        ],
      },
      workbox: {
        // The app shell: src/app.html and the code of the field sheet and the portal (see shellFiles);
        // other pages' code is kept once seen. No /api answer is ever cached by the service worker.
        globPatterns: ['src/app.html', 'assets/*.{js,css}'],
        manifestTransforms: [
          (entries) => {
            const keep = shellFiles(path.join(root, outDir));
            return { manifest: entries.filter((e) => !e.url.startsWith('assets/') || keep.has(e.url)), warnings: [] };
          },
        ],
        navigateFallback: '/src/app.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/login/, /^\/index\.html/],
        runtimeCaching: [
          {
            urlPattern: ({ url, sameOrigin }) => sameOrigin && url.pathname.startsWith('/assets/') && !url.pathname.endsWith('.map'),
            handler: 'CacheFirst',
            options: { cacheName: 'browseline-assets', expiration: { maxEntries: 300, maxAgeSeconds: 90 * 24 * 3600 } },
          },
        ],
        cleanupOutdatedCaches: true,
        clientsClaim: false,
        skipWaiting: false,
      },
    }),
    precompressAssets(),
  ],
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': 'http://127.0.0.1:3000' },
  },
  preview: { host: '127.0.0.1', port: 4173 },
  build: {
    outDir,
    manifest: true,
    // Source maps are written for error reports but not linked from the code, and the server does not serve them in production.
    sourcemap: 'hidden',
    chunkSizeWarningLimit: 1500,
    rolldownOptions: {
      input: { index: path.join(root, 'index.html'), app: path.join(root, 'src/app.html') },
      output: {
        // Fewer, steadier chunks: React (sign-in and app), the app's libraries (router, query cache), maps apart.
        codeSplitting: {
          groups: [
            { name: 'react', test: /node_modules[\\/](react|react-dom|scheduler)[\\/]/ },
            { name: 'app-libs', test: /node_modules[\\/](react-router|@tanstack[\\/](query-core|react-query|query-persist-client-core|react-query-persist-client|query-async-storage-persister))[\\/]/ },
            // The app's small shared modules and the field sheet's own code, each one file rather than dozens
            // (on a 400 ms round trip every extra request counts). None of them may import zod or a chart.
            {
              name: 'app-core',
              includeDependenciesRecursively: false,
              // Not what the sign-in page uses (api-client, paths, persisted-cache, session-requests, button, text-field, brand): that stays apart.
              test: /[\\/]src[\\/](lib[\\/](query-client|persist-rules|query-persistence|cache-saver|update-state|route-params|format|quantity-format)\.ts|app[\\/](route-loaders|lazy-page)\.ts|features[\\/](field[\\/]api[\\/](get-field-home|get-my-tasks|get-task|keys)\.ts|(portal|desk)[\\/]api[\\/][^\\/]+|auth[\\/]api[\\/](get-me|login)\.ts)|components[\\/](ui[\\/](card|toast|offline-notice|update-prompt)|layouts[\\/](user-menu|require-role))\.tsx)$/,
            },
            {
              // What every field page paints with: its layout, shell, task cards and the completion queue.
              name: 'field',
              includeDependenciesRecursively: false,
              test: /[\\/]src[\\/](features[\\/]field[\\/](hooks[\\/][^\\/]+|api[\\/](complete-task|skip-task)\.ts|lib[\\/](completion-queue|completion-store|task-text)\.ts|components[\\/](task-card|queue-notice)\.tsx)|app[\\/]routes[\\/]field[\\/]field-shell\.tsx|components[\\/]layouts[\\/]field-layout\.tsx)$/,
            },
            {
              // The field sheet's list page apart, so that opening a task does not download it.
              name: 'field-home',
              includeDependenciesRecursively: false,
              test: /[\\/]src[\\/]app[\\/]routes[\\/]field[\\/]field-home\.tsx$/,
            },
            {
              // A task's page (with the notice for a form whose code has not arrived): loads when a task is opened, precached for no signal.
              name: 'field-task',
              includeDependenciesRecursively: false,
              test: /[\\/]src[\\/](features[\\/]field[\\/]lib[\\/]geo-uri\.ts|app[\\/]routes[\\/]field[\\/]field-task\.tsx|components[\\/]ui[\\/]code-boundary\.tsx)$/,
            },
            {
              // The task's unit sketch (drawn through d3-geo) and directions: one small file the task page asks for as it starts, precached for no signal.
              name: 'field-task-place',
              includeDependenciesRecursively: false,
              test: /[\\/](src[\\/]features[\\/]field[\\/](lib[\\/](unit-sketch|directions)\.ts|components[\\/](unit-map|directions)\.tsx)|shared[\\/]domain[\\/]map-projection\.ts)$/,
            },
          ],
        },
      },
    },
  },
});
