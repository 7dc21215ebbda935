import { IonToast } from '@ionic/react';
import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';

/** How long the Undo stays on screen before the change is recorded. */
export const UNDO_MS = 6000;

interface Pending {
  key: string;
  message: string;
  commit: () => void;
}

/**
 * A change that cannot be taken back once recorded ("Flushed", "Removed") is held for six
 * seconds behind an Undo toast, then recorded with the time of the tap. Leaving the screen
 * records it at once; a second change records the first.
 */
export function useUndo(): {
  offer: (key: string, message: string, commit: () => void) => void;
  /** Keys of changes waiting behind the toast (show them as done already). */
  waiting: ReadonlySet<string>;
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
    (key: string, message: string, commit: () => void) => {
      if (ref.current) settle(true);
      const next = { key, message, commit };
      ref.current = next;
      setPending(next);
    },
    [settle],
  );

  useEffect(() => () => ref.current?.commit(), []);

  const waiting = new Set(pending ? [pending.key] : []);
  const toast = (
    <IonToast
      isOpen={pending !== null}
      message={pending?.message}
      duration={UNDO_MS}
      position="bottom"
      cssClass="pp-undo"
      buttons={[{ text: 'Undo', role: 'cancel', handler: () => settle(false) }]}
      onDidDismiss={(e) => {
        if (e.detail.role !== 'cancel') settle(true);
      }}
    />
  );
  return { offer, waiting, toast };
}
