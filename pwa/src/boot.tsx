// The app itself, loaded by main.tsx once the splash has painted.
import { setupIonicReact } from '@ionic/react';
import { StrictMode, startTransition } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';
import { sessionStore } from './app/services';
import { redirectFor } from './features/shell/model/access';

const reducedMotion = window.matchMedia('(prefers-reduced-motion: reduce)').matches;

// One look on every phone (Material mode; the build drops Ionic's other look's styles, see
// vite.startup.ts), no ripples, no page slides when motion is reduced.
setupIonicReact({ mode: 'md', rippleEffect: false, animated: !reducedMotion });

// Settle the first screen before anything renders: a signed-out visitor goes straight to
// sign-in without loading the tab shell, a signed-in one skips the sign-in screen.
const target = redirectFor(window.location.pathname, sessionStore.get()?.user.role ?? null);
if (target !== null) window.history.replaceState(null, '', target);

// A signed-in start opens on Today, read from the phone's database: wake IndexedDB (cold, it
// takes a few hundred ms to open) and fetch the tab shell and Today's screen side by side now,
// not one after the other as they render (the lazy pages then find them loaded).
if (sessionStore.get() && window.location.pathname === '/today') {
  void indexedDB.databases?.().catch(() => undefined);
  void import('./app/MainTabs');
  void import('./pages/TodayPage');
}

const root = document.getElementById('root');
if (!root) throw new Error('index.html has no #root element');

// A transition, so React renders the first screen in slices and the page keeps answering taps
// (the splash is showing meanwhile).
startTransition(() => {
  createRoot(root).render(
    <StrictMode>
      <App />
    </StrictMode>,
  );
});
