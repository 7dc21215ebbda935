// The JavaScript budget of the first two screens (sign-in, then Today once signed in), checked
// by `npx size-limit` in scripts/test right after the PWA is built. The files are read from
// Vite's build manifest (pwa/scripts/first-screens.mjs): the entry, the SignIn, MainTabs and
// Today route chunks and every chunk they import statically.
//
// How size-limit 12 with @size-limit/file counts: each file gzipped on its own at level 9
// (node:zlib createGzip({ level: 9 })), the sizes summed; "kB" is 1000 bytes (bytes-iec:
// "200 kB" = 200,000 bytes, "KiB" would be 1024). pwa/scripts/report-size.mjs and
// scripts/bench/bundle count the same way.
//
// The goal is 200 kB. The limit below is a ratchet at today's figure (≈232.5 kB after moving
// Ionic's overlays, other screens' icons, the sync engine and the commands out of the startup
// chunks, then the sheets opened by a tap and the command catalogue behind photos and
// signatures, then Ionic's unused ios style sheets, then Vite's preload helper and the second
// component runtime that `<ion-icon>` brought (icons are inline SVG now, src/components/Icon.tsx);
// raised once by 1 kB for the cached clock-time formatter, a module of its own that saves a
// formatter per render, and once by 8 kB (≈240.3 kB) for starting in three parts, each run in a
// task of its own (React's DOM renderer, Ionic, the app; src/boot.tsx): separate chunks compress
// a little worse, and it halved the main thread's blocking time at startup (Lighthouse TBT on
// Today 898 -> 545 ms, sign-in 298 -> 143 ms)), and once by 0.1 kB (≈241.07 kB) for loading the
// first screen's code before the first render (src/App.tsx preloadFirstScreen, lazyPage's
// preload): a suspended first screen was revealed 250-300 ms late, and an offline start showed
// Today about 300 ms sooner without it, and once by 0.2 kB (≈241.28 kB) for rendering the signed-in
// shell once at startup (src/App.tsx: React Router's Routes at the top, tabs routed without a
// splat where they have no pages under them; sync/SyncProvider.tsx: one tree with or without the
// database, which is opened before the first render): Lighthouse TBT on Today 533 -> 232 ms and
// 304 -> 260 ms, performance 0.87 -> 0.96 and 0.93 -> 0.95 (medians of 5, two rounds side by
// side). Lowered to ≈240.18 kB by drawing the tab pages' header and the tab labels as plain
// elements instead of Ionic's header, toolbar, buttons and labels (ion-label left the app), then
// to ≈240.06 kB with the session check in a component of its own (SessionCheck), then to
// ≈239.31 kB with our own tab bar of plain links (features/shell/components/TabBar.tsx) in
// place of Ionic's tab bar and tab buttons, then to ≈215.27 kB by building the same code into
// 15 files instead of 95 (pwa/vite.startup.ts, startupChunkGroups): each file is compressed
// as a whole, and fewer chunks carry less import and export glue, then to ≈213.10 kB with
// Ionic's component classes marked pure (pwa/vite.startup.ts, markIonicClassesPure: the tab
// bar's and tab buttons' classes stayed after the app stopped using them), then to ≈202.40 kB
// with Ionic's page and bar components (button, buttons, content, footer, header, title,
// toolbar) built by the app (pwa/src/components/ionic.ts) and taken out of @ionic/react's
// startup module, and the sign-in screen's body a plain element, then to ≈198.94 kB, under the
// goal, with the elements @ionic/react imports for components the app never shows (ion-icon,
// ion-tab-bar, ion-tab-button) loaded only if one is used (pwa/vite.startup.ts,
// deferredIonicTags): imported statically, they kept their code and the ripple effect in the
// startup chunks; raised by 0.05 kB (≈198.99 kB) for Today reading its lists only after a new
// phone's first sync (features/today/components/TodayScreen.tsx): it showed the lists from
// before the sync ("nothing due") for a moment, then filled them and pushed the rest down
// (pwa/e2e/today-layout.e2e.ts). It stops the bundle from growing. Lower it with every step down; never raise
// it without saying why in the commit.
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { firstScreenFiles, firstScreensGoalKb, pwaDist } from './pwa/scripts/first-screens.mjs';

const root = fileURLToPath(new URL('.', import.meta.url));
const dist = pwaDist();

export default [
  {
    name: `sign-in + Today JavaScript, gzipped (goal ${firstScreensGoalKb} kB)`,
    path: firstScreenFiles(dist).map((file) => relative(root, join(dist, file))),
    gzip: true,
    limit: process.env.PANELPASS_BUNDLE_LIMIT ?? '198.99 kB',
  },
];
