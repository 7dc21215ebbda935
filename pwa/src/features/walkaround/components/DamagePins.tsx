import { useIonToast } from '@ionic/react';
import { useMemo, useState } from 'react';
import type { DamagePinRow } from '@panelpass/shared';
import { useChanges } from '../../../sync/useChanges';
import { PhotoImage } from '../../photos';
import { VehicleOutlineDrawing, type OutlinePin } from '../../outline/VehicleOutlineDrawing';
import {
  panelAt,
  panelCentre,
  pinPlace,
  toFraction,
  vehicleOutline,
} from '../../outline/vehicleOutline';
import { FOOTER_ID } from '../../workspace/components/StageActions';
import { bodyStyleWords } from '../../workspace/model/jobWords';
import type { WalkaroundData } from '../hooks/useWalkaround';
import { FLAG_WORDS } from '../model/film';
import { pinKindWords, severityWords } from '../model/pins';
import { PinSheet, type PinDraftTarget, type PinSheetResult } from './PinSheet';

/**
 * Damage pins on the vehicle outline: tap the drawing where the damage is, say what it is in
 * the sheet; the pins are listed under the drawing with edit and remove (Undo for six
 * seconds). "Add damage from a list" does the same without the drawing.
 */
export function DamagePins({ data }: { data: WalkaroundData }) {
  const { job, vehicle, panels, pins, photos, readOnly } = data;
  const recorder = useChanges();
  const [presentToast] = useIonToast();
  const [target, setTarget] = useState<PinDraftTarget | null>(null);
  const bodyStyle = vehicle?.bodyStyle ?? 'sedan';
  const outline = vehicleOutline(bodyStyle);
  const labels = useMemo(() => new Map(panels.map((p) => [p.panelKey, p.label])), [panels]);
  const nextNumber = pins.reduce((max, p) => Math.max(max, p.number), 0) + 1;
  const panelName = (key: string | null) => (key ? (labels.get(key) ?? key) : 'not on a panel');

  const drawn: OutlinePin[] = pins.map((p) => ({
    id: p.id,
    number: p.number,
    ...pinPlace(outline, p.panelKey, p.x, p.y),
    severity: p.severity,
  }));
  // Panels the film readings flag, marked on the drawing too.
  const flagged = data.film.panels.filter(
    (p) => (p.flags?.flags.length ?? 0) > 0 || (p.spots.length > 0 && !p.stats),
  );
  const marked = new Set(flagged.map((p) => p.panel.panelKey));
  if (target?.mode === 'new' && target.x !== null && target.y !== null) {
    drawn.push({
      id: 'pending',
      number: nextNumber,
      x: target.x,
      y: target.y,
      severity: 1,
      pending: true,
    });
  }

  const description = `Outline of the ${bodyStyleWords(bodyStyle)} from above, sides folded out, front at the top. ${
    pins.length === 0
      ? 'No damage pins yet.'
      : `${pins.length} damage ${pins.length === 1 ? 'pin' : 'pins'}: ${pins
          .map(
            (p) =>
              `${p.number}, ${pinKindWords(p.kind).toLowerCase()} on ${panelName(p.panelKey).toLowerCase()}`,
          )
          .join('; ')}.`
  }${
    flagged.length
      ? ` Marked by the readings: ${flagged
          .map(
            (p) =>
              `${p.panel.label.toLowerCase()} (${(p.flags?.flags ?? []).map((f) => FLAG_WORDS[f].toLowerCase()).join(', ') || 'reading not valid'})`,
          )
          .join('; ')}.`
      : ''
  }`;

  /** Where a pin without a tapped place goes: on its panel, a little apart from the others. */
  function placeFor(panelKey: string | null, count: number): { x: number; y: number } {
    const centre = panelKey ? panelCentre(outline, panelKey) : null;
    const spread = ((count % 5) - 2) * 0.012;
    return {
      x: toFraction((centre?.x ?? 0.5) + spread),
      y: toFraction((centre?.y ?? 0.5) + spread),
    };
  }

  async function keepPhoto(pinId: string, result: PinSheetResult): Promise<string | null | false> {
    if (!result.photo) return null;
    const photoId = crypto.randomUUID();
    const stored = await recorder.attachPhoto({
      id: photoId,
      jobId: job.id,
      kind: 'damage',
      subjectType: 'pin',
      subjectId: pinId,
      data: result.photo.data,
      mime: result.photo.mime,
      width: result.photo.width,
      height: result.photo.height,
    });
    return stored ? photoId : false;
  }

  async function save(result: PinSheetResult): Promise<boolean> {
    if (!target) return false;
    if (target.mode === 'new') {
      const id = crypto.randomUUID();
      const photoId = await keepPhoto(id, result);
      if (photoId === false) return false;
      // The tapped place, unless the panel was changed in the sheet to one elsewhere.
      const tapped = target.x !== null && target.y !== null ? { x: target.x, y: target.y } : null;
      const at =
        tapped &&
        (result.panelKey === null || panelAt(outline, tapped.x, tapped.y) === result.panelKey)
          ? tapped
          : placeFor(result.panelKey, pins.length);
      const stored = await recorder.changes.addPin({
        id,
        jobId: job.id,
        ...at,
        panelKey: result.panelKey,
        kind: result.kind,
        severity: result.severity,
        note: result.note,
        ...(photoId ? { photoId } : {}),
      });
      return stored !== null;
    }
    const pin = target.pin;
    const photoId = await keepPhoto(pin.id, result);
    if (photoId === false) return false;
    const moved =
      result.panelKey !== pin.panelKey && panelAt(outline, pin.x, pin.y) !== result.panelKey;
    const stored = await recorder.changes.updatePin({
      id: pin.id,
      panelKey: result.panelKey,
      kind: result.kind,
      severity: result.severity,
      note: result.note,
      ...(photoId ? { photoId } : {}),
      ...(moved ? placeFor(result.panelKey, pins.length) : {}),
    });
    return stored !== null;
  }

  async function remove(pin: DamagePinRow) {
    setTarget(null);
    const stored = await recorder.changes.removePin({ id: pin.id });
    if (!stored) return;
    void presentToast({
      message: `Pin ${pin.number} removed.`,
      duration: 6000,
      position: 'bottom',
      positionAnchor: FOOTER_ID,
      cssClass: 'pp-toast',
      buttons: [
        {
          text: 'Undo',
          handler: () => {
            void recorder.changes.addPin({
              id: crypto.randomUUID(),
              jobId: pin.jobId,
              number: pin.number,
              x: pin.x,
              y: pin.y,
              panelKey: pin.panelKey,
              kind: pin.kind,
              severity: pin.severity,
              note: pin.note,
              ...(pin.photoId ? { photoId: pin.photoId } : {}),
            });
          },
        },
      ],
    });
  }

  const photoOf = (pin: DamagePinRow) => photos.find((p) => p.id === pin.photoId) ?? null;
  const editing = target?.mode === 'edit' ? target.pin : null;

  return (
    <div className="pp-damage">
      <p className="pp-section-hint">
        {readOnly
          ? 'Where the damage was found.'
          : 'Tap the drawing where the damage is. Numbers match the list below.'}
        {flagged.length ? ' A thick frame with “!” marks a panel the film readings flag.' : ''}
      </p>
      <VehicleOutlineDrawing
        bodyStyle={bodyStyle}
        pins={drawn}
        marked={marked}
        description={description}
        {...(readOnly
          ? {}
          : {
              onTap: ({ x, y, panelKey }: { x: number; y: number; panelKey: string | null }) =>
                setTarget({
                  mode: 'new',
                  x,
                  y,
                  panelKey: panelKey && labels.has(panelKey) ? panelKey : null,
                }),
            })}
      />
      {pins.length ? (
        <ol className="pp-pins" aria-label="Damage pins">
          {pins.map((pin) => {
            const photo = photoOf(pin);
            return (
              <li key={pin.id} className="pp-pin">
                <span className="pp-pin__number" aria-hidden="true">
                  {pin.number}
                </span>
                <div className="pp-pin__words">
                  <p className="pp-pin__what">
                    <span className="pp-visually-hidden">Pin {pin.number}: </span>
                    {pinKindWords(pin.kind)} · {panelName(pin.panelKey)}
                  </p>
                  <p className="pp-pin__how">
                    {severityWords(pin.severity)} ({pin.severity} of 3)
                  </p>
                  {pin.note ? <p className="pp-pin__note">{pin.note}</p> : null}
                </div>
                {photo ? <PhotoImage photo={photo} className="pp-pin__photo" /> : null}
                {readOnly ? null : (
                  <div className="pp-pin__actions">
                    <button
                      type="button"
                      className="pp-small-button"
                      aria-label={`Edit pin ${pin.number}`}
                      onClick={() => setTarget({ mode: 'edit', pin })}
                    >
                      Edit
                    </button>
                    <button
                      type="button"
                      className="pp-small-button pp-small-button--stop"
                      aria-label={`Remove pin ${pin.number}`}
                      onClick={() => void remove(pin)}
                    >
                      Remove
                    </button>
                  </div>
                )}
              </li>
            );
          })}
        </ol>
      ) : (
        <p className="pp-section-hint">No damage marked yet.</p>
      )}
      {readOnly ? null : (
        <button
          type="button"
          className="pp-button pp-button--quiet-go"
          onClick={() => setTarget({ mode: 'new', x: null, y: null, panelKey: null })}
        >
          Add damage from a list
        </button>
      )}
      <PinSheet
        target={target}
        panels={panels}
        photo={editing ? photoOf(editing) : null}
        number={editing ? editing.number : nextNumber}
        onSave={save}
        {...(editing ? { onRemove: () => void remove(editing) } : {})}
        onClose={() => setTarget(null)}
      />
    </div>
  );
}
