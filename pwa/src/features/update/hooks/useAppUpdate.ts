import { useRegisterSW } from 'virtual:pwa-register/react';

/** Look for a new version this often while the app stays open all day. */
const checkEveryMs = 60 * 60 * 1000;

export interface AppUpdate {
  /** A new version is installed and waiting for the user's go-ahead. */
  ready: boolean;
  /** Switch to the new version now: the page reloads into it. */
  reload: () => void;
  /** Keep working on this version; the new one starts next time the app opens. */
  later: () => void;
}

/**
 * Registers the service worker and says when a new version waits. The old version keeps
 * running until the user accepts, so nothing asks for files that are gone.
 */
export function useAppUpdate(): AppUpdate {
  const {
    needRefresh: [ready, setReady],
    updateServiceWorker,
  } = useRegisterSW({
    onRegisteredSW(_url, registration) {
      if (!registration) return;
      const check = () => {
        if (navigator.onLine && !registration.installing) void registration.update();
      };
      setInterval(check, checkEveryMs);
      document.addEventListener('visibilitychange', () => {
        if (document.visibilityState === 'visible') check();
      });
    },
  });

  return {
    ready,
    reload: () => {
      // The plugin reloads only for a worker it saw registered itself; one found later by
      // an update check counts as "external" and would take over without a reload.
      navigator.serviceWorker.addEventListener('controllerchange', () => window.location.reload(), {
        once: true,
      });
      void updateServiceWorker(true);
    },
    later: () => setReady(false),
  };
}
