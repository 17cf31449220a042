import { defineConfig, type Plugin } from 'vite';
import preact from '@preact/preset-vite';
import { VitePWA } from 'vite-plugin-pwa';

// One build for any folder of any static host: base './' makes every asset URL relative to the
// page, and the manifest's start_url, scope and id are relative to the manifest itself (which sits
// beside index.html). Nothing in the app may start with '/'.
//
// The Content-Security-Policy is a meta tag in index.html (a static host may not let you set
// headers). Its connect-src must allow the office address the crew types into Settings, which a
// build cannot know: by default it allows 'self', any https: origin and a loopback http server
// (an office laptop on the same machine). Scripts stay 'self' only, so no injected code can run to
// use that freedom. An office that knows its address can pin it at build time:
//   BANKSIDE_CONNECT_SRC="https://office.example.org" npm run build
export const DEFAULT_CONNECT_SRC = "https: http://127.0.0.1:* http://localhost:*";

function contentSecurityPolicy(): Plugin {
  const connect = (process.env.BANKSIDE_CONNECT_SRC ?? DEFAULT_CONNECT_SRC).trim();
  if (/[;'"<>]/.test(connect)) throw new Error(`BANKSIDE_CONNECT_SRC must be a list of origins (got ${connect})`);
  return {
    name: 'bankside-csp',
    transformIndexHtml: {
      order: 'post',
      handler(html, ctx) {
        // The dev server injects <style> elements for hot reload: the policy applies to builds only.
        if (ctx.server) return html.replace(/\s*<meta http-equiv="Content-Security-Policy"[^>]*>/, '');
        return html.replace('%BANKSIDE_CONNECT_SRC%', connect);
      },
    },
  };
}

export default defineConfig({
  base: './',
  plugins: [
    preact(),
    contentSecurityPolicy(),
    VitePWA({
      strategies: 'injectManifest',
      srcDir: 'src/sw',
      filename: 'sw.ts',
      registerType: 'prompt',
      injectRegister: false,
      includeAssets: ['icons/*.png', 'icons/*.svg'],
      injectManifest: {
        globPatterns: ['**/*.{js,css,html,svg,png,webmanifest,woff2}'],
        // install-prompt pictures are fetched by the browser when it shows the prompt, never offline
        globIgnores: ['screenshots/**'],
        rollupFormat: 'iife',
      },
      manifest: {
        // relative to the manifest's own URL: the folder the app was copied into
        id: './',
        start_url: './',
        scope: './',
        name: 'Bankside field water chemistry',
        short_name: 'Bankside',
        description:
          'Record stream, spring and well samples offline and see their saturation state at the bank.',
        lang: 'en',
        display: 'standalone',
        orientation: 'portrait',
        theme_color: '#0b3d4f',
        background_color: '#f4f1e8',
        categories: ['productivity', 'utilities'],
        icons: [
          { src: 'icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: 'icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          { src: 'icons/maskable-192.png', sizes: '192x192', type: 'image/png', purpose: 'maskable' },
          { src: 'icons/maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
        ],
        shortcuts: [
          { name: 'New sample', short_name: 'New', url: './#/new', icons: [{ src: 'icons/icon-192.png', sizes: '192x192', type: 'image/png' }] },
          { name: 'Send to office', short_name: 'Send', url: './#/send', icons: [{ src: 'icons/icon-192.png', sizes: '192x192', type: 'image/png' }] },
        ],
        // made from the real app by scripts/make-screenshots.mjs
        screenshots: [
          { src: 'screenshots/today-narrow.png', sizes: '780x1688', type: 'image/png', form_factor: 'narrow', label: "Today's samples with their saturation state" },
          { src: 'screenshots/sample-narrow.png', sizes: '780x1688', type: 'image/png', form_factor: 'narrow', label: 'One sample with its calcite saturation index' },
          { src: 'screenshots/today-wide.png', sizes: '1280x800', type: 'image/png', form_factor: 'wide', label: 'The day at the office' },
        ],
        // an installed app opens a lab's CSV straight into the lab import (File Handling API)
        file_handlers: [{ action: './?open=lab-import', accept: { 'text/csv': ['.csv'] } }],
      },
      devOptions: { enabled: false },
    }),
  ],
  build: { target: 'es2022', sourcemap: false },
  // the export worker is a module worker, so it can load the schemas on demand like the page
  worker: { format: 'es' },
  preview: { port: 4173, strictPort: true, host: '127.0.0.1' },
});
