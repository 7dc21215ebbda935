import { setupIonicReact } from '@ionic/react';

/**
 * Ionic's setup for every phone: one look (Material mode; the build drops Ionic's other look's
 * styles, see vite.startup.ts), no ripples, no page slides when motion is reduced. A module of
 * its own so src/boot.tsx can run Ionic in a task of its own (a dynamic import of
 * '@ionic/react' itself would keep every one of its components).
 */
export function startIonic(): void {
  const reducedMotion = window.matchMedia('(prefers-reduced-motion: reduce)').matches;
  setupIonicReact({ mode: 'md', rippleEffect: false, animated: !reducedMotion });
}
