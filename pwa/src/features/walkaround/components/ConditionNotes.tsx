import { useEffect, useId, useRef, useState } from 'react';
import { Glyph } from '../../../components/Glyph';
import { useChanges } from '../../../sync/useChanges';

type SaveState = 'saved' | 'typing' | 'saving' | 'failed';

const PAUSE_MS = 1200;

/**
 * What the car looks like, in the detailer's words. Saved on the phone after a short pause
 * in typing and when the field is left (job.update), with "Saved" said beside it.
 */
export function ConditionNotes({
  jobId,
  saved,
  readOnly,
}: {
  jobId: string;
  /** The notes as stored. */
  saved: string;
  readOnly: boolean;
}) {
  const recorder = useChanges();
  const id = useId();
  // Once the person types here, their text is what shows (a pull does not overwrite it).
  const [draft, setDraft] = useState<string | null>(null);
  const [state, setState] = useState<SaveState>('saved');
  const timer = useRef<number | null>(null);
  const lastSent = useRef<string | null>(null);
  const text = draft ?? saved;

  async function save(value: string) {
    if (timer.current !== null) window.clearTimeout(timer.current);
    timer.current = null;
    if (value === saved || value === lastSent.current) {
      setState('saved');
      return;
    }
    setState('saving');
    lastSent.current = value;
    const stored = await recorder.changes.updateJob({ id: jobId, conditionNotes: value });
    if (stored) setState((s) => (s === 'saving' ? 'saved' : s));
    else {
      lastSent.current = null;
      setState('failed');
    }
  }

  function typed(value: string) {
    setDraft(value);
    setState('typing');
    if (timer.current !== null) window.clearTimeout(timer.current);
    timer.current = window.setTimeout(() => void save(value), PAUSE_MS);
  }

  // Leaving the screen mid-sentence still keeps the words.
  const pending = useRef<{ value: string; dirty: boolean }>({ value: text, dirty: false });
  pending.current = { value: text, dirty: state === 'typing' };
  const saveRef = useRef(save);
  saveRef.current = save;
  useEffect(
    () => () => {
      if (timer.current !== null) window.clearTimeout(timer.current);
      if (pending.current.dirty) void saveRef.current(pending.current.value);
    },
    [],
  );

  return (
    <div className="pp-field pp-notes">
      <label className="pp-field__label" htmlFor={id}>
        Condition notes
      </label>
      <p className="pp-field__hint" id={`${id}-hint`}>
        What you and the owner see before any work: swirls, scratches, repaired panels.
      </p>
      <div className="pp-field__control">
        <textarea
          id={id}
          className="pp-field__input pp-notes__input"
          value={text}
          rows={4}
          readOnly={readOnly}
          aria-describedby={`${id}-hint ${id}-state`}
          onChange={(e) => typed(e.target.value)}
          onBlur={() => {
            if (state === 'typing') void save(text);
          }}
        />
      </div>
      <p className={`pp-notes__state pp-notes__state--${state}`} id={`${id}-state`} role="status">
        {state === 'saved' ? (
          <>
            <Glyph name="check" size={20} /> {readOnly ? 'Job closed: read only' : 'Saved'}
          </>
        ) : state === 'failed' ? (
          <>
            <Glyph name="alert" size={20} /> Not saved — keep the screen open and try again
          </>
        ) : (
          <>
            <Glyph name="refresh" size={20} /> {state === 'saving' ? 'Saving…' : 'Not saved yet'}
          </>
        )}
      </p>
    </div>
  );
}
