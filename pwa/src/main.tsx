// The page's styles (render-blocking, so index.html's splash is drawn styled), then the app.
// Only the Ionic CSS the components need, not the optional utility sheets.
import '@ionic/react/css/core.css';
import '@ionic/react/css/normalize.css';
import '@ionic/react/css/structure.css';
import '@ionic/react/css/typography.css';
// Atkinson Hyperlegible, bundled: regular and bold, Latin only.
import './theme/fonts.css';
import './theme/variables.css';
import './theme/app.css';
import { afterFirstPaint } from './app/afterFirstPaint';
import { warmIntl } from './app/warmIntl';
import { warmLocalDb } from './db/warmLocalDb';
import { createSessionStore } from './features/auth/model/sessionStore';
import { redirectFor } from './features/shell/model/access';

// Settle the first screen before anything loads: a signed-out visitor goes straight to sign-in
// without loading the tab shell, a signed-in one skips the sign-in screen.
const user = createSessionStore(window.localStorage).get()?.user ?? null;
const role = user?.role ?? null;
const target = redirectFor(window.location.pathname, role);
if (target !== null) window.history.replaceState(null, '', target);

function startApp() {
  void import('./boot');
  // A signed-in start opens on Today, read from the phone's database: have the browser read it
  // from disk (cold, that takes a few hundred ms) and fetch the tab shell and Today's screen
  // beside the app's code, not one after the other as they render (the lazy pages then find
  // them loaded). While that code arrives the main thread would wait: it loads the locale's
  // data for formatting then (app/warmIntl.ts), in short tasks of its own, instead of inside the
  // first screen's render.
  if (user !== null && role !== 'customer' && window.location.pathname === '/today') {
    void warmLocalDb(user.id).catch(() => undefined);
    warmIntl();
    void import('./app/MainTabs');
    void import('./pages/TodayPage');
  }
}

// The installed app (a service worker in control) has its code on the phone, with no line to
// share: start at once. A first visit paints the splash first, on its own; then the app's code
// is fetched and run, so on a slow line that first paint does not wait behind it.
if (navigator.serviceWorker?.controller) startApp();
else afterFirstPaint(startApp);
