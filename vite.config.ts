/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { compression } from 'vite-plugin-compression2';
import { VitePWA } from 'vite-plugin-pwa';
import type { Plugin } from 'vite';
import { fileURLToPath } from 'node:url';

// One alias a layer (also in tsconfig.json, which tsx and the linter read), so no import climbs folders.
export const aliases = {
  '@': fileURLToPath(new URL('./src', import.meta.url)),
  '@server': fileURLToPath(new URL('./server', import.meta.url)),
  '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
  '@tests': fileURLToPath(new URL('./tests', import.meta.url)),
};

/**
 * A preload link in index.html for each core Barlow file (src/assets/fonts): every first screen uses the three
 * weights, and without the hint the browser finds them only after the script has drawn the screen.
 */
function preloadCoreFonts(): Plugin {
  return {
    name: 'gaugewalk:preload-core-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler: (_html, { bundle }) =>
        Object.values(bundle ?? {})
          .filter(
            (file) => file.type === 'asset' && /^assets\/barlow-\d+-core-.+\.woff2$/.test(file.fileName),
          )
          .map((file) => ({
            tag: 'link',
            attrs: {
              rel: 'preload',
              href: `/${file.fileName}`,
              as: 'font',
              type: 'font/woff2',
              crossorigin: '',
            },
            injectTo: 'head' as const,
          })),
    },
  };
}

/**
 * Two chunk groups (Rolldown's code splitting):
 * - `index`: everything a first screen loads with the page stays in the one entry file. (With any group at all,
 *   Rolldown otherwise cuts the entry into a dozen files.) Its runtime helper is a small file of its own.
 * - `screen-parts`: the small shared pieces the board, the kiosk's work screens and the desk draw airframes with
 *   (state and verdict badges, the airframe lines, the words and units they use, the shared queries). Left to
 *   itself, the bundler made seven chunks of them, one for each set of screens that shares them, and the board's
 *   first screen fetched each: 19 requests; grouped, its LCP under Lighthouse's slow 4G fell 0.1 to 0.2 s (measured,
 *   README). A module added to that family should join the list; one left out only costs a request.
 */
const chunkGroups = [
  { name: 'index', tags: ['$initial' as const], priority: 10 },
  {
    name: 'screen-parts',
    test: /[\\/](shared[\\/]schemas[\\/](board-address|airframes|unit-codes)|shared[\\/]domain[\\/](ata|units|words)|shared[\\/]i18n[\\/]phrase|src[\\/]lib[\\/](shared-queries|use-now)|src[\\/]components[\\/]ui[\\/](defect-lines|state-badge|airframe-lines|verdict-badge))\.tsx?$/,
    // Their imports (React, i18next, the API client) are in the entry already; they stay there.
    includeDependenciesRecursively: false,
  },
];

const apiTarget = `http://127.0.0.1:${process.env.PORT ?? '8080'}`;

export default defineConfig({
  // A brotli and a gzip copy of each asset beside it; the server sends the one the browser accepts.
  plugins: [
    react(),
    tailwindcss(),
    preloadCoreFonts(),
    // The offline shell: every built screen, font and icon precached; API answers never cached (they are records
    // and states that must be current). A new version waits until the screen offers it (src/app/update-offer.tsx).
    VitePWA({
      registerType: 'prompt',
      injectRegister: false,
      manifest: false,
      workbox: {
        globPatterns: ['**/*.{js,css,html,woff2,svg,png,ico}'],
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/manifest\.webmanifest$/, /^\/kiosk-icons\//],
        runtimeCaching: [],
        cleanupOutdatedCaches: true,
      },
    }),
    // Not the build manifest: it is the server's, never sent (and a compressed copy beside it would be).
    compression({ algorithms: ['brotliCompress', 'gzip'], exclude: [/\.vite[\\/]/] }),
  ],
  resolve: { alias: aliases },
  server: {
    port: Number(process.env.VITE_PORT ?? 5173),
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  // The manifest tells the server which files each address's first screen loads
  // (server/middleware/first-screen-hints.ts).
  build: {
    outDir: 'dist',
    sourcemap: false,
    chunkSizeWarningLimit: 800,
    manifest: true,
    rolldownOptions: { output: { codeSplitting: { groups: chunkGroups } } },
  },
  test: {
    // Shared words read in English where a test calls them without a translate function, as the server does.
    setupFiles: ['server/i18n/translator.ts'],
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          include: ['shared/**/*.test.ts', 'src/**/*.test.{ts,tsx}', 'server/**/*.test.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          globalSetup: ['tests/setup/api-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 30_000,
          hookTimeout: 60_000,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          globalSetup: ['tests/setup/e2e-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 90_000,
          hookTimeout: 120_000,
        },
      },
      {
        extends: true,
        test: {
          // Breaks things on purpose (kills MariaDB and the server); each file starts what it kills.
          name: 'fault',
          include: ['tests/fault/**/*.test.ts'],
          fileParallelism: false,
          testTimeout: 120_000,
          hookTimeout: 90_000,
        },
      },
    ],
  },
});
