// The app itself, loaded by main.tsx (which has already settled the first screen's address).
// Its three big parts are run one task each, with a breath between, so that a phone's main
// thread is never held for long while starting: React's DOM renderer, Ionic, then the app.
import { StrictMode, startTransition } from 'react';

/** Lets the browser handle input and paint before the next part runs. */
const breathe = () => new Promise<void>((resolve) => setTimeout(resolve, 0));

const { createRoot } = await import('react-dom/client');
await breathe();
const { startIonic } = await import('./app/startIonic');
await breathe();
startIonic();
await breathe();

const { App } = await import('./App');
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
