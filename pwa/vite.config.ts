import { fileURLToPath } from 'node:url';
import react from '@vitejs/plugin-react';
import { defineConfig } from 'vite';
import { VitePWA } from 'vite-plugin-pwa';
import { createRequire } from 'node:module';
import {
  deferIonicOverlays,
  iconPerModule,
  ionicMdStylesOnly,
  ownIonicComponents,
  startupChunkGroups,
  trimmedIonicReact,
} from './vite.startup.ts';

const sharedEntry = fileURLToPath(new URL('../shared/src/index.ts', import.meta.url));
const src = (path: string) => fileURLToPath(new URL(`./src/${path}`, import.meta.url));

/** The first screens' code in a few chunks (vite.startup.ts, startupChunkGroups). */
const startupGroups = startupChunkGroups({
  early: { name: 'start', roots: [src('main.tsx'), src('boot.tsx')] },
  // boot.tsx's three parts, in its order.
  parts: [
    { name: 'renderer', roots: [createRequire(import.meta.url).resolve('react-dom/client')] },
    { name: 'ionic', roots: [src('app/startIonic.ts')] },
    { name: 'app', roots: [src('App.tsx')] },
  ],
  screens: [
    { name: 'tabs', roots: [src('app/MainTabs.tsx'), src('pages/TodayPage.tsx')] },
    { name: 'sign-in', roots: [src('pages/SignInPage.tsx')] },
  ],
  shared: 'app',
  barrels: [
    '@ionic/react/dist/index.js',
    '@tanstack/query-core/build/modern/index.js',
    '@tanstack/react-query/build/modern/index.js',
    'shared/src/index.ts',
    'uuid/dist/esm-browser/index.js',
  ],
});

// Colours come from ../shared/design/look.md: `go` for the browser chrome, white behind the splash.
const themeColour = '#00626B';
const backgroundColour = '#FFFFFF';

export default defineConfig({
  plugins: [
    // Keep overlays and other screens' icons out of the startup chunks (see vite.startup.ts).
    iconPerModule(),
    // Components @ionic/react builds but the app never uses left out, one component runtime;
    // those the app builds itself (src/components/ionic.ts) taken out. Before the overlays are
    // deferred: ion-icon is deferred from where this plugin points it.
    trimmedIonicReact(ownIonicComponents),
    deferIonicOverlays(),
    // The app pins Ionic's md look; the ios style sheets are emptied (see vite.startup.ts).
    ionicMdStylesOnly(),
    react(),
    VitePWA({
      // A new version waits until the detailer taps "Reload": a half-updated shell could ask
      // for chunks that no longer exist, in the middle of a job.
      registerType: 'prompt',
      injectRegister: false,
      // The icons are precached by the glob below already; listing them twice is noise.
      includeManifestIcons: false,
      manifest: {
        id: '/',
        name: 'Panelpass',
        short_name: 'Panelpass',
        description: "The day's cars, panels and timers for a mobile detailer.",
        lang: 'en',
        start_url: '/',
        scope: '/',
        display: 'standalone',
        orientation: 'portrait',
        theme_color: themeColour,
        background_color: backgroundColour,
        icons: [
          { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
          { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
          {
            src: '/icons/maskable-512.png',
            sizes: '512x512',
            type: 'image/png',
            purpose: 'maskable',
          },
        ],
      },
      workbox: {
        // App shell, route chunks, styles, the bundled font (woff2 only: every browser we
        // support reads it) and the icons; the plugin adds the web manifest itself. API
        // answers are never cached here.
        globPatterns: ['**/*.{html,js,css,woff2,png,svg}'],
        navigateFallback: 'index.html',
        navigateFallbackDenylist: [/^\/api(\/|$)/],
        cleanupOutdatedCaches: true,
        // Take control of the first page that installed us, so it works offline without a
        // reload. Updates still wait (no skipWaiting) until the user accepts.
        clientsClaim: true,
        skipWaiting: false,
        // What tapping a timer alarm's notification does (public/sw-alarms.js, plain and
        // small). Imported scripts are stored with the worker, so it works offline; a change to
        // it changes the precache revision, hence the worker, and goes through the update prompt.
        importScripts: ['sw-alarms.js'],
      },
    }),
  ],
  resolve: {
    alias: { '@panelpass/shared': sharedEntry },
    // @ionic/react-router carries its own nested copy of @ionic/react; two copies would mean
    // two router contexts and twice the bytes.
    dedupe: [
      'react',
      'react-dom',
      'react-router',
      'react-router-dom',
      '@ionic/react',
      '@ionic/core',
      'ionicons',
    ],
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // scripts/first-screens.mjs reads this to list the sign-in and Today screens' JavaScript
    // (the budget in ../.size-limit.mjs, scripts/report-size.mjs, scripts/bench/bundle).
    manifest: true,
    target: 'es2022',
    // No <link rel="modulepreload"> per dependency of each lazy chunk: adding those links cost
    // ~30 ms of main thread on every start here (one per chunk, most of them already cached by
    // the service worker). The browser still fetches a chunk's imports in parallel as it parses
    // it; CSS of lazy chunks is still loaded by Vite's helper.
    modulePreload: false,
    rolldownOptions: {
      output: {
        codeSplitting: { groups: startupGroups },
      },
      treeshake: {
        // Ionic and Ionicons do not declare `sideEffects` in their package.json, so every
        // component module they re-export would be kept (~300 kB gzipped). Their modules only
        // define things when called (defineCustomElement), so keep just what we import.
        moduleSideEffects: [
          {
            test: /[\\/]node_modules[\\/](@ionic[\\/](core|react|react-router)|ionicons)[\\/].*\.js$/,
            sideEffects: false,
          },
          // shared/ is pure domain logic (no module does anything when loaded), reached through
          // one barrel: keep only the modules a chunk really uses.
          { test: /[\\/]shared[\\/]src[\\/].*\.ts$/, sideEffects: false },
        ],
      },
    },
  },
  server: {
    host: '127.0.0.1',
    proxy: {
      '/api': { target: 'http://127.0.0.1:8080', changeOrigin: false },
    },
  },
  preview: {
    host: '127.0.0.1',
    proxy: {
      '/api': { target: 'http://127.0.0.1:8080', changeOrigin: false },
    },
  },
});
