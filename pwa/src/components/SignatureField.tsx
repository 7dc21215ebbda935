import { useEffect, useId, useImperativeHandle, useRef, useState, type Ref } from 'react';
import type SignaturePad from 'signature_pad';
import './signatureField.css';

/** What a form holding the pad may ask of it. */
export interface SignatureFieldHandle {
  /** The drawing as PNG bytes, or null while the box is empty. */
  toPng(): Uint8Array | null;
  clear(): void;
}

/** A data URL's bytes, without any fetch. */
function dataUrlBytes(dataUrl: string): Uint8Array {
  const text = atob(dataUrl.slice(dataUrl.indexOf(',') + 1));
  const bytes = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) bytes[i] = text.charCodeAt(i);
  return bytes;
}

/**
 * A box to sign in with a finger (signature_pad, loaded only when the box is first shown),
 * named by its label for screen readers, with its state in words ("The box is empty.") and
 * a Clear button. `active` starts the pad once the box has its size on screen (a sheet that
 * has finished opening); the form reads the drawing through `ref`.
 */
export function SignatureField({
  label = 'Sign here',
  active,
  onInkedChange,
  ref,
}: {
  label?: string;
  active: boolean;
  onInkedChange?: (inked: boolean) => void;
  ref?: Ref<SignatureFieldHandle>;
}) {
  const ids = useId();
  const canvas = useRef<HTMLCanvasElement>(null);
  const pad = useRef<SignaturePad | null>(null);
  const [state, setState] = useState<'loading' | 'ready' | 'failed'>('loading');
  const [inked, setInked] = useState(false);
  const report = useRef(onInkedChange);
  report.current = onInkedChange;

  useEffect(() => {
    if (!active) return;
    let live = true;
    const el = canvas.current;
    void (async () => {
      try {
        const { default: Pad } = await import('signature_pad');
        if (!live || !el) return;
        const ratio = Math.max(window.devicePixelRatio || 1, 1);
        el.width = el.offsetWidth * ratio;
        el.height = el.offsetHeight * ratio;
        el.getContext('2d')?.scale(ratio, ratio);
        const made = new Pad(el, {
          penColor: '#0b1220',
          backgroundColor: '#ffffff',
          minWidth: 1,
          maxWidth: 3.2,
        });
        made.addEventListener('endStroke', () => {
          const now = !made.isEmpty();
          setInked(now);
          report.current?.(now);
        });
        made.clear();
        pad.current = made;
        setInked(false);
        report.current?.(false);
        setState('ready');
      } catch {
        if (live) setState('failed');
      }
    })();
    return () => {
      live = false;
      pad.current?.off();
      pad.current = null;
    };
  }, [active]);

  function clear() {
    pad.current?.clear();
    setInked(false);
    report.current?.(false);
  }

  useImperativeHandle(
    ref,
    () => ({
      toPng: () => {
        const p = pad.current;
        if (!p || p.isEmpty()) return null;
        return dataUrlBytes(p.toDataURL('image/png'));
      },
      clear,
    }),
    [],
  );

  return (
    <div className="pp-sigfield">
      <p className="pp-sigfield__label" id={`${ids}-label`}>
        {label}
      </p>
      <canvas
        ref={canvas}
        className="pp-sigfield__canvas"
        role="img"
        aria-labelledby={`${ids}-label`}
        aria-describedby={`${ids}-state`}
      />
      <div className="pp-sigfield__bar">
        <span id={`${ids}-state`} className="pp-sigfield__state" aria-live="polite">
          {state === 'failed'
            ? 'The signing box did not load. Close this and try again.'
            : state === 'loading'
              ? 'Loading the signing box…'
              : inked
                ? 'Signed in the box.'
                : 'The box is empty.'}
        </span>
        <button
          type="button"
          className="pp-sigfield__clear"
          onClick={clear}
          disabled={!inked}
          aria-label="Clear the signature"
        >
          Clear
        </button>
      </div>
    </div>
  );
}
