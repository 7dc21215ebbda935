import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonFooter, IonHeader, IonToolbar } from '../../../components/ionic';
import { useEffect, useId, useState } from 'react';
import type { DamagePinRow, JobPanelRow, PhotoRow } from '@panelpass/shared';
import { Notice } from '../../../components/Notice';
import { PhotoImage, PhotoPicker, type ResizedImage } from '../../photos';
import { PIN_KINDS, PIN_KIND_WORDS, SEVERITIES, SEVERITY_WORDS, type PinKind } from '../model/pins';

/**
 * What the sheet edits: a new pin where the outline was tapped (or, added from the list
 * without a place, put on its panel when saved), or a pin already there.
 */
export type PinDraftTarget =
  | { mode: 'new'; x: number | null; y: number | null; panelKey: string | null }
  | { mode: 'edit'; pin: DamagePinRow };

export interface PinSheetResult {
  panelKey: string | null;
  kind: PinKind;
  severity: number;
  note: string;
  /** A new photo taken in the sheet (made smaller already), to keep with the pin. */
  photo: ResizedImage | null;
}

/**
 * The damage at a pin: where (panel), what kind, how bad (1–3), a note and an optional photo.
 * Save is at the bottom, in thumb reach.
 */
export function PinSheet({
  target,
  panels,
  photo,
  number,
  onSave,
  onRemove,
  onClose,
}: {
  target: PinDraftTarget | null;
  panels: readonly JobPanelRow[];
  /** The photo already kept with the pin (editing). */
  photo: PhotoRow | null;
  /** The number the pin has (or will have). */
  number: number;
  onSave: (result: PinSheetResult) => Promise<boolean>;
  onRemove?: () => void;
  onClose: () => void;
}) {
  const ids = useId();
  const editing = target?.mode === 'edit' ? target.pin : null;
  const [panelKey, setPanelKey] = useState<string>('');
  const [kind, setKind] = useState<PinKind | null>(null);
  const [severity, setSeverity] = useState<number>(2);
  const [note, setNote] = useState('');
  const [newPhoto, setNewPhoto] = useState<ResizedImage | null>(null);
  const [preview, setPreview] = useState<string | null>(null);
  const [busy, setBusy] = useState<'photo' | 'save' | null>(null);
  const [problem, setProblem] = useState<string | null>(null);

  // Fill the form each time the sheet opens.
  useEffect(() => {
    if (!target) return;
    if (target.mode === 'edit') {
      setPanelKey(target.pin.panelKey ?? '');
      setKind(
        (PIN_KINDS as readonly string[]).includes(target.pin.kind)
          ? (target.pin.kind as PinKind)
          : 'other',
      );
      setSeverity(target.pin.severity);
      setNote(target.pin.note);
    } else {
      setPanelKey(target.panelKey ?? '');
      setKind(null);
      setSeverity(2);
      setNote('');
    }
    setNewPhoto(null);
    setProblem(null);
  }, [target]);

  useEffect(() => {
    if (!newPhoto) {
      setPreview(null);
      return;
    }
    const url = URL.createObjectURL(new Blob([newPhoto.data], { type: newPhoto.mime }));
    setPreview(url);
    return () => URL.revokeObjectURL(url);
  }, [newPhoto]);

  async function takePhoto(file: File) {
    setBusy('photo');
    setProblem(null);
    try {
      const { resizeImage } = await import('../../photos/resizeImage');
      setNewPhoto(await resizeImage(file));
    } catch (error) {
      setProblem(error instanceof Error ? error.message : 'The photo could not be read.');
    } finally {
      setBusy(null);
    }
  }

  async function save() {
    if (!kind) {
      setProblem('Pick what kind of damage it is.');
      return;
    }
    setBusy('save');
    try {
      const ok = await onSave({
        panelKey: panelKey || null,
        kind,
        severity,
        note: note.trim(),
        photo: newPhoto,
      });
      if (ok) onClose();
    } finally {
      setBusy(null);
    }
  }

  const title = editing ? `Damage ${number}` : `New damage, pin ${number}`;
  return (
    <IonModal isOpen={target !== null} onDidDismiss={onClose} aria-label={title}>
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id={`${ids}-title`} className="pp-header__title">
              {title}
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Cancel
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page pp-wk-sheet">
          <div className="pp-field">
            <label className="pp-field__label" htmlFor={`${ids}-panel`}>
              Where
            </label>
            <div className="pp-field__control">
              <select
                id={`${ids}-panel`}
                className="pp-field__input pp-wk-select"
                value={panelKey}
                onChange={(e) => setPanelKey(e.target.value)}
              >
                <option value="">Not on a panel (glass, trim, wheel…)</option>
                {panels.map((p) => (
                  <option key={p.id} value={p.panelKey}>
                    {p.label}
                  </option>
                ))}
              </select>
            </div>
          </div>

          <fieldset className="pp-wk-choices">
            <legend className="pp-field__label">What</legend>
            <div className="pp-wk-choices__row">
              {PIN_KINDS.map((k) => (
                <label key={k} className="pp-wk-choice">
                  <input
                    type="radio"
                    name={`${ids}-kind`}
                    value={k}
                    checked={kind === k}
                    onChange={() => setKind(k)}
                  />
                  <span>{PIN_KIND_WORDS[k]}</span>
                </label>
              ))}
            </div>
          </fieldset>

          <fieldset className="pp-wk-choices">
            <legend className="pp-field__label">How bad</legend>
            <div className="pp-wk-choices__row pp-wk-choices__row--three">
              {SEVERITIES.map((s) => (
                <label key={s} className="pp-wk-choice">
                  <input
                    type="radio"
                    name={`${ids}-severity`}
                    value={s}
                    checked={severity === s}
                    onChange={() => setSeverity(s)}
                  />
                  <span className="pp-wk-choice__stack">
                    <span className="pp-wk-choice__big">{s}</span> {SEVERITY_WORDS[s]}
                  </span>
                </label>
              ))}
            </div>
          </fieldset>

          <div className="pp-field">
            <label className="pp-field__label" htmlFor={`${ids}-note`}>
              Note <span className="pp-optional">(optional)</span>
            </label>
            <div className="pp-field__control">
              <textarea
                id={`${ids}-note`}
                className="pp-field__input pp-notes__input"
                rows={2}
                maxLength={2000}
                value={note}
                onChange={(e) => setNote(e.target.value)}
              />
            </div>
          </div>

          <div className="pp-pin-photo">
            <p className="pp-field__label">
              Photo <span className="pp-optional">(optional)</span>
            </p>
            {preview ? (
              <img
                className="pp-pin-photo__img"
                src={preview}
                alt={`New photo of damage ${number}`}
              />
            ) : photo ? (
              <PhotoImage photo={photo} className="pp-pin-photo__img" />
            ) : null}
            <PhotoPicker
              quiet
              busy={busy === 'photo'}
              label={preview || photo ? 'Take it again' : 'Take a photo of it'}
              onPicked={(file) => void takePhoto(file)}
            />
          </div>

          {problem ? <Notice tone="stop">{problem}</Notice> : null}
        </div>
      </IonContent>
      <IonFooter>
        <IonToolbar>
          <div className="pp-wk-sheet__actions">
            {editing && onRemove ? (
              <button type="button" className="pp-button pp-wk-button-stop" onClick={onRemove}>
                Remove
              </button>
            ) : null}
            <button
              type="button"
              className="pp-button pp-wk-sheet__main"
              disabled={busy !== null}
              onClick={() => void save()}
            >
              {editing ? 'Save changes' : 'Save the pin'}
            </button>
          </div>
        </IonToolbar>
      </IonFooter>
    </IonModal>
  );
}
