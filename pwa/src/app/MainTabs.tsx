import { IonRouterOutlet, IonTabs } from '@ionic/react';
import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect } from 'react';
import { Route } from 'react-router-dom';
import { SessionCheck } from '../features/auth/components/SessionCheck';
import { useCurrentUser } from '../features/auth/hooks/useCurrentUser';
import type { Role } from '../features/auth/model/session';
import {
  settingsPath,
  tabRoutePath,
  tabs,
  tabsForRole,
  within,
  type TabId,
} from '../features/shell/model/access';
import { TabBar } from '../features/shell/components/TabBar';
import { TimerDock } from '../features/timers/components/TimerDock';
import { SyncProvider } from '../sync/SyncProvider';
import { lazyPage } from './lazyPage';
import { queryClient } from './queryClient';

/** For App's preloadFirstScreen, which loads this chunk before the first render. */
export { openLocalDbEarly } from '../sync/SyncProvider';

const pages: Record<TabId, ReturnType<typeof lazyPage>> = {
  today: lazyPage(() => import('../pages/TodayPage')),
  jobs: lazyPage(() => import('../pages/JobsPage')),
  clients: lazyPage(() => import('../pages/ClientsPage')),
  shelf: lazyPage(() => import('../pages/ShelfPage')),
  ledger: lazyPage(() => import('../pages/LedgerPage')),
};

/** Settings: not a tab; opened from the header's Settings button. */
const SettingsPage = lazyPage(() => import('../pages/SettingsPage'));

/**
 * Fetches the tabs' code a little after the first screen (PRELOAD_AFTER_MS, so it never competes
 * with it), one page per idle moment (app/preloadPages.ts), so a tab's first tap shows it at once
 * instead of suspending (a suspended page's reveal is held back some 300 ms; see lazyPage). The
 * service worker has them precached.
 */
const PRELOAD_AFTER_MS = 2000;

function usePreloadedTabs(role: Role | null) {
  useEffect(() => {
    if (!role) return;
    const start = window.setTimeout(() => {
      void import('./preloadPages').then(({ preloadPages }) =>
        preloadPages(tabsForRole(role).map((tab) => pages[tab.id])),
      );
    }, PRELOAD_AFTER_MS);
    return () => window.clearTimeout(start);
  }, [role]);
}

/** Loads the code of the page at `pathname` (a tab or Settings), if any, before it is shown. */
export async function preloadPage(pathname: string): Promise<void> {
  const tab = tabs.find((t) => within(pathname, t.path));
  await (tab ? pages[tab.id] : within(pathname, settingsPath) ? SettingsPage : null)?.preload();
}

/**
 * The bottom tab bar and its pages, as the signed-in role may see them. Sync (the phone's
 * database and the engine) starts here, after sign-in, so the sign-in screen never loads it.
 */
export default function MainTabs() {
  return (
    <QueryClientProvider client={queryClient}>
      <SyncProvider>
        <SessionCheck />
        <SignedInTabs />
      </SyncProvider>
    </QueryClientProvider>
  );
}

function SignedInTabs() {
  const user = useCurrentUser();
  const visible = user ? tabsForRole(user.role) : [];
  usePreloadedTabs(user ? user.role : null);

  return (
    <IonTabs>
      <IonRouterOutlet>
        {visible.map((tab) => {
          const Page = pages[tab.id];
          return <Route key={tab.id} path={tabRoutePath(tab)} element={<Page />} />;
        })}
        {/* No route rather than a null child: Ionic's outlet reads each child's type, and a
            session ending on Settings (sign-out, the business deleted) would crash it. */}
        {user ? <Route path={settingsPath} element={<SettingsPage />} /> : []}
      </IonRouterOutlet>
      {/* Alarms and the timer strip, above the tab bar (ion-tabs' bottom slot). */}
      {user ? <TimerDock slot="bottom" /> : null}
      <TabBar tabs={visible} slot="bottom" />
    </IonTabs>
  );
}
