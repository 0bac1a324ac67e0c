/// <reference types="vitest/config" />
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';

const apiPort = Number(process.env.SALTATION_API_PORT ?? 4311);

export default defineConfig({
  plugins: [
    react(),
    VitePWA({
      // Updates are offered to the user (never forced), so a running page is not broken by a
      // deploy while it has lazy chunks or unsynced edits.
      registerType: 'prompt',
      injectRegister: false,
      includeAssets: ['favicon.svg', 'icons/*.png'],
      manifest: {
        name: 'Saltation',
        short_name: 'Saltation',
        description: 'Scenario sandbox for stochastic-volatility-with-jumps option smiles',
        theme_color: '#0F766E',
        background_color: '#FBFAF7',
        display: 'standalone',
        start_url: '/',
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      workbox: {
        globPatterns: ['**/*.{js,css,html,svg,png,woff2,webmanifest}'],
        // The Plotly chunk is over Workbox's 2 MiB default and must be there offline.
        maximumFileSizeToCacheInBytes: 8 * 1024 * 1024,
        navigateFallback: '/index.html',
        navigateFallbackDenylist: [/^\/api\//, /^\/dev\//],
        cleanupOutdatedCaches: true,
      },
    }),
  ],
  worker: { format: 'es' },
  build: {
    target: 'es2022',
    // Plotly is lazy-loaded in a chunk of its own (about 1.4 MB gzip); everything else stays small.
    chunkSizeWarningLimit: 5000,
  },
  server: {
    host: '127.0.0.1',
    proxy: { '/api': `http://127.0.0.1:${apiPort}` },
  },
  test: {
    projects: [
      {
        extends: true,
        // generous: a loaded shared machine must not turn slow into failed (speed lives in bench)
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30000,
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          testTimeout: 20000,
          hookTimeout: 30000,
          fileParallelism: false,
        },
      },
      {
        extends: true,
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          environment: 'node',
          testTimeout: 60000,
          hookTimeout: 90000,
          fileParallelism: false,
        },
      },
    ],
  },
});
