import type { ReactNode } from 'react';
import { Notice } from '../../../components/Notice';
import { useCurrentUser } from '../../auth/hooks/useCurrentUser';

/** Quotes carry prices: only the owner sees them (a helper is told so, in words). */
export function OwnerOnly({ children }: { children: ReactNode }) {
  const user = useCurrentUser();
  if (!user) return <div className="pp-loading" aria-busy="true" />;
  if (user.role !== 'owner') {
    return <Notice tone="info">Quotes and prices are the owner&apos;s; ask them.</Notice>;
  }
  return <>{children}</>;
}
