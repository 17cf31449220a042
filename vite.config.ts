import { defineConfig } from 'vite';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';

// The service worker is our own file (src/sw/sw.ts): it precaches the app shell and,
// in later work, drains the upload outbox. registerType 'prompt' never reloads a page
// by itself: the app asks the crew, and only after the open draft is saved.
export default defineConfig({
  plugins: [
    preact(),
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'src/sw',
      filename: 'sw.ts',
      registerType: 'prompt',
      injectRegister: false,
      includeAssets: ['icons/*.png', 'icons/*.svg'],
      injectManifest: {
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest,woff2}'],
        rollupFormat: 'iife',
      },
      manifest: {
        id: '/',
        name: 'Bankside field water chemistry',
        short_name: 'Bankside',
        description:
          'Record stream, spring and well samples offline and see their saturation state at the bank.',
        lang: 'en',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        theme_color: '#0b3d4f',
        background_color: '#f4f1e8',
        icons: [
          { src: 'icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: 'icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: 'icons/maskable-192.png', sizes: '192x192', type: 'image/png', purpose: 'maskable' },
          { src: 'icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
      },
      devOptions: { enabled: false },
    }),
  ],
  build: { target: 'es2022', sourcemap: false },
  preview: { port: 4173, strictPort: true, host: '127.0.0.1' },
});
