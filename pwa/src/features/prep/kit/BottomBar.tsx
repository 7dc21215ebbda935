import type { ReactNode } from 'react';

/** The stage's main action(s), kept at the bottom of the screen within thumb reach. */
export function BottomBar({ children, label }: { children: ReactNode; label: string }) {
  return (
    <div className="pp-stage-bar" role="group" aria-label={label}>
      {children}
    </div>
  );
}
