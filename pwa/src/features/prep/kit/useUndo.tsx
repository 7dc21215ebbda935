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
 * element `anchorId` (the stage's bottom bar), so it never covers a main action.
 */
export function useUndo(anchorId?: string): {
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

  useEffect(() => () => ref.current?.commit(), []);

  const waiting = new Map(pending ? [[pending.key, pending.atMs]] : []);
  const toast = (
    <IonToast
      isOpen={pending !== null}
      message={pending?.message}
      duration={UNDO_MS}
      position="bottom"
      {...(anchorId ? { positionAnchor: anchorId } : {})}
      cssClass="pp-undo"
      buttons={[{ text: 'Undo', role: 'cancel', handler: () => settle(false) }]}
      onDidDismiss={(e) => {
        if (e.detail.role !== 'cancel') settle(true);
      }}
    />
  );
  return { offer, waiting, toast };
}
