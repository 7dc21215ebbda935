import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonFooter, IonHeader, IonToolbar } from '../../../components/ionic';
import { useEffect, useId, useRef, useState, type ReactNode } from 'react';
import type SignaturePad from 'signature_pad';
import type { CanonicalValue } from '@panelpass/shared';
import { Notice } from '../../../components/Notice';
import { useChanges } from '../../../sync/useChanges';
import type { ConditionRecord } from '../model/conditionRecord';
import { RecordView } from './RecordView';

/** The pad's PNG (a data URL) as bytes, without any fetch. */
function pngBytes(dataUrl: string): Uint8Array {
  const base64 = dataUrl.slice(dataUrl.indexOf(',') + 1);
  const text = atob(base64);
  const bytes = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
  return bytes;
}

/** What a signature sheet says: the owner's condition signature unless told otherwise. */
export interface SignatureWords<R> {
  kind: 'condition' | 'acceptance';
  title: string;
  intro: string;
  signLabel: string;
  /** Draws the record being signed, from the record alone. */
  view: (record: R) => ReactNode;
}

const CONDITION_WORDS: SignatureWords<ConditionRecord> = {
  kind: 'condition',
  title: "Owner's signature",
  intro:
    'Please read the condition of your car as we found it, before any work. Signing says you agree this is how it was.',
  signLabel: 'Sign the condition record',
  view: (record) => <RecordView record={record} />,
};

/**
 * The owner reads the record, types their name and signs on the glass. The pad
 * (signature_pad) is loaded only when this sheet opens. The signature is kept with the hash
 * of exactly this record (signature.capture) and is never changed afterwards. The condition
 * record by default; the handover passes its own words for the acceptance signature.
 */
export function SignatureSheet<R extends { [key: string]: CanonicalValue } = ConditionRecord>({
  isOpen,
  jobId,
  record,
  onClose,
  words = CONDITION_WORDS as unknown as SignatureWords<R>,
}: {
  isOpen: boolean;
  jobId: string;
  record: R;
  onClose: () => void;
  words?: SignatureWords<R>;
}) {
  const ids = useId();
  const recorder = useChanges();
  const canvas = useRef<HTMLCanvasElement>(null);
  const pad = useRef<SignaturePad | null>(null);
  const [name, setName] = useState('');
  const [inked, setInked] = useState(false);
  const [ready, setReady] = useState(false);
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  // The record as it was when the sheet opened: what the owner reads is what they sign.
  const [shown, setShown] = useState<R>(record);

  function opened() {
    setShown(record);
    setName('');
    setInked(false);
    setProblem(null);
    void startPad();
  }

  async function startPad() {
    const el = canvas.current;
    if (!el) return;
    try {
      const { default: Pad } = await import('signature_pad');
      const ratio = Math.max(window.devicePixelRatio || 1, 1);
      el.width = el.offsetWidth * ratio;
      el.height = el.offsetHeight * ratio;
      el.getContext('2d')?.scale(ratio, ratio);
      pad.current?.off();
      const made = new Pad(el, {
        penColor: '#0b1220',
        backgroundColor: '#ffffff',
        minWidth: 1,
        maxWidth: 3.2,
      });
      made.addEventListener('endStroke', () => setInked(!made.isEmpty()));
      made.clear();
      pad.current = made;
      setReady(true);
    } catch {
      setProblem('The signing pad did not load. Close this and try again.');
    }
  }

  useEffect(
    () => () => {
      pad.current?.off();
      pad.current = null;
    },
    [],
  );

  function clear() {
    pad.current?.clear();
    setInked(false);
  }

  async function sign() {
    const p = pad.current;
    if (!p || p.isEmpty() || !name.trim()) return;
    setBusy(true);
    setProblem(null);
    try {
      const stored = await recorder.captureSignature({
        id: crypto.randomUUID(),
        jobId,
        kind: words.kind,
        signerName: name.trim(),
        record: shown,
        image: pngBytes(p.toDataURL('image/png')),
        mime: 'image/png',
      });
      if (stored) onClose();
    } catch (error) {
      setProblem(error instanceof Error ? error.message : 'The signature was not saved.');
    } finally {
      setBusy(false);
    }
  }

  const missing = !name.trim()
    ? 'The owner types their name.'
    : !inked
      ? 'The owner signs in the box.'
      : null;

  return (
    <IonModal
      isOpen={isOpen}
      onDidPresent={opened}
      onDidDismiss={() => {
        setReady(false);
        onClose();
      }}
      aria-label={words.title}
    >
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id={`${ids}-title`} className="pp-header__title">
              {words.title}
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Cancel
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page pp-wk-sheet">
          <p className="pp-section-hint">{words.intro}</p>
          {words.view(shown)}
          <div className="pp-field">
            <label className="pp-field__label" htmlFor={`${ids}-name`}>
              Your name
            </label>
            <div className="pp-field__control">
              <input
                id={`${ids}-name`}
                className="pp-field__input"
                autoComplete="name"
                maxLength={120}
                value={name}
                onChange={(e) => setName(e.target.value)}
              />
            </div>
          </div>
          <div className="pp-pad">
            <p className="pp-field__label" id={`${ids}-pad`}>
              Sign here
            </p>
            <canvas
              ref={canvas}
              className="pp-pad__canvas"
              role="img"
              aria-labelledby={`${ids}-pad`}
              aria-describedby={`${ids}-pad-state`}
            />
            <div className="pp-pad__bar">
              <span id={`${ids}-pad-state`} className="pp-section-hint">
                {!ready
                  ? 'Loading the signing pad…'
                  : inked
                    ? 'Signed in the box.'
                    : 'The box is empty.'}
              </span>
              <button type="button" className="pp-small-button" onClick={clear} disabled={!inked}>
                Clear
              </button>
            </div>
          </div>
          {problem ? <Notice tone="stop">{problem}</Notice> : null}
        </div>
      </IonContent>
      <IonFooter>
        <IonToolbar>
          <div className="pp-wk-sheet__actions pp-wk-sheet__actions--column">
            <p className="pp-wk-sheet__status" role="status">
              {missing ?? `Signing as ${name.trim()}.`}
            </p>
            <button
              type="button"
              className="pp-button pp-wk-sheet__main"
              disabled={busy || missing !== null}
              onClick={() => void sign()}
            >
              {words.signLabel}
            </button>
          </div>
        </IonToolbar>
      </IonFooter>
    </IonModal>
  );
}
