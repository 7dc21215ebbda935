import type { ReactNode } from 'react';

/** The stage's main action(s), kept at the bottom of the screen within thumb reach. */
export function BottomBar({
  children,
  label,
  id,
}: {
  children: ReactNode;
  label: string;
  /** For a toast to sit above it. */
  id?: string;
}) {
  return (
    <div className="pp-stage-bar" role="group" aria-label={label} id={id}>
      {children}
    </div>
  );
}
