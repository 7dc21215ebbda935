// The app itself, loaded by main.tsx (which has already settled the first screen's address).
// Its three big parts, React's DOM renderer, Ionic and the app, are fetched side by side and
// each run in a task of its own, with a breath between, so that a phone's main thread is never
// held for long while starting.
import { StrictMode, startTransition } from 'react';

/** Lets the browser handle input and paint before the next part runs. */
const breathe = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

const renderer = import('react-dom/client');
const ionic = import('./app/startIonic');
const app = import('./App');

const { createRoot } = await renderer;
await breathe();
const { startIonic } = await ionic;
await breathe();
startIonic();
await breathe();

const { App, preloadFirstScreen } = await app;
// The first screen's code, so that it renders at once (a failure shows through the lazy page).
await preloadFirstScreen(window.location.pathname).catch(() => undefined);
await breathe();

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
