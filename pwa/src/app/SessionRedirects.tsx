import { useIonRouter } from '@ionic/react';
import { useEffect } from 'react';
import { useLocation } from 'react-router-dom';
import { useSession } from '../features/auth/hooks/useSession';
import { redirectFor } from '../features/shell/model/access';

/**
 * Moves the app when the session changes or a screen is not for this role: to the sign-in
 * screen when signed out, to the role's home after signing in, away from the Ledger for a
 * tech. Renders nothing.
 */
export function SessionRedirects() {
  const { pathname } = useLocation();
  const role = useSession()?.user.role ?? null;
  const router = useIonRouter();

  useEffect(() => {
    const target = redirectFor(pathname, role);
    if (target !== null && target !== pathname) router.push(target, 'root', 'replace');
  }, [pathname, role, router]);

  return null;
}
