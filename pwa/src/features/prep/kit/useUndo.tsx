import { IonToast } from '@ionic/react';
import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';

/** How long the Undo stays on screen before the change is recorded. */
export const UNDO_MS = 6000;

interface Pending {
  key: string;
  message: string;
  commit: () => void;
  atMs: number;
}

/**
 * A change that cannot be taken back once recorded ("Flushed", "Removed") is held for six
 * seconds behind an Undo toast, then recorded with the time of the tap. Leaving the screen
 * records it at once; a second change records the first. The toast sits just above the
 * page's footer when it has one (the workspace's stage moves), so it never covers them.
 */
export function useUndo(): {
  /** Holds a change behind the Undo; `atMs` is the time of the tap it will be recorded with. */
  offer: (key: string, message: string, commit: () => void, atMs: number) => void;
  /** Changes waiting behind the toast, by key, with the time of the tap (show them as done). */
  waiting: ReadonlyMap<string, number>;
  toast: ReactNode;
} {
  const [pending, setPending] = useState<Pending | null>(null);
  const ref = useRef<Pending | null>(null);

  const settle = useCallback((record: boolean) => {
    const current = ref.current;
    ref.current = null;
    setPending(null);
    if (current && record) current.commit();
  }, []);

  const offer = useCallback(
    (key: string, message: string, commit: () => void, atMs: number) => {
      if (ref.current) settle(true);
      const next = { key, message, commit, atMs };
      ref.current = next;
      setPending(next);
    },
    [settle],
  );

  // Leaving the screen records what waits (once: a late dismiss finds nothing left).
  useEffect(
    () => () => {
      const current = ref.current;
      ref.current = null;
      current?.commit();
    },
    [],
  );

  // The footer of the page on show (not a page hidden behind it in the router's stack).
  const anchor = pending
    ? document.querySelector<HTMLElement>('.ion-page:not(.ion-page-hidden) > ion-footer')
    : null;
  const waiting = new Map(pending ? [[pending.key, pending.atMs]] : []);
  const toast = (
    <IonToast
      isOpen={pending !== null}
      message={pending?.message}
      duration={UNDO_MS}
      position="bottom"
      {...(anchor ? { positionAnchor: anchor } : {})}
      cssClass="pp-undo"
      buttons={[{ text: 'Undo', role: 'cancel', handler: () => settle(false) }]}
      onDidDismiss={(e) => {
        if (e.detail.role !== 'cancel') settle(true);
      }}
    />
  );
  return { offer, waiting, toast };
}
