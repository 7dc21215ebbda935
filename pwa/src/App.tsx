import { IonApp } from '@ionic/react';
import { IonReactRouter } from '@ionic/react-router';
import { Route, Routes } from 'react-router-dom';
import { lazyPage } from './app/lazyPage';
import { within } from './features/shell/model/access';
import { SessionRedirects } from './app/SessionRedirects';
import { UpdateBanner } from './features/update/components/UpdateBanner';

const SignInPage = lazyPage(() => import('./pages/SignInPage'));
const StartBusinessPage = lazyPage(() => import('./pages/StartBusinessPage'));
const InviteAcceptPage = lazyPage(() => import('./pages/InviteAcceptPage'));
const CustomerHomePage = lazyPage(() => import('./pages/CustomerHomePage'));
const CustomerLinkPage = lazyPage(() => import('./features/customer/CustomerLinkPage'));
const PaidPage = lazyPage(() => import('./pages/PaidPage'));
const MainTabs = lazyPage(() => import('./app/MainTabs'));

/**
 * Loads the code of the screen at `pathname` before the first render (boot.tsx awaits it; a
 * signed-in start has fetched it beside the app's code already), so that screen renders without
 * suspending: a suspended first screen showed some 250–300 ms late (see lazyPage). The tab
 * shell's database starts opening here too, while the first render runs.
 */
export async function preloadFirstScreen(pathname: string): Promise<void> {
  const screens = [
    ['/sign-in', SignInPage],
    ['/start', StartBusinessPage],
    ['/invite', InviteAcceptPage],
    ['/customer', CustomerHomePage],
    ['/c', CustomerLinkPage],
    ['/paid', PaidPage],
  ] as const;
  const screen = screens.find(([base]) => within(pathname, base));
  if (screen) {
    await screen[1].preload();
    return;
  }
  const tabs = await MainTabs.preload();
  tabs.openLocalDbEarly();
  await tabs.preloadPage(pathname);
}

/**
 * The routes stay the same whoever is signed in; SessionRedirects moves people to the
 * screens their session and role allow.
 *
 * The top level is React Router's own `Routes`, not an Ionic outlet: these screens are separate
 * places (signed out, the customer's, the tab shell), never a stack to animate between. An Ionic
 * outlet mounts its page in a second, synchronous render after its own first commit, and the
 * shell's `/*` splat made Ionic's router render the whole app once more to copy its `*` param:
 * both in the first screen's longest task (docs/benchmarks.md, Lighthouse Today).
 */
export function App() {
  return (
    <IonApp>
      <IonReactRouter>
        <SessionRedirects />
        <Routes>
          <Route path="/sign-in" element={<SignInPage />} />
          <Route path="/start" element={<StartBusinessPage />} />
          <Route path="/invite/:token" element={<InviteAcceptPage />} />
          <Route path="/customer" element={<CustomerHomePage />} />
          <Route path="/c/:token" element={<CustomerLinkPage />} />
          <Route path="/paid" element={<PaidPage />} />
          <Route path="/*" element={<MainTabs />} />
        </Routes>
      </IonReactRouter>
      <UpdateBanner />
    </IonApp>
  );
}
