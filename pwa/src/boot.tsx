// The app itself, loaded by main.tsx (which has already settled the first screen's address).
import { setupIonicReact } from '@ionic/react';
import { StrictMode, startTransition } from 'react';
import { createRoot } from 'react-dom/client';
import { App } from './App';

const reducedMotion = window.matchMedia('(prefers-reduced-motion: reduce)').matches;

// One look on every phone (Material mode; the build drops Ionic's other look's styles, see
// vite.startup.ts), no ripples, no page slides when motion is reduced.
setupIonicReact({ mode: 'md', rippleEffect: false, animated: !reducedMotion });

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
