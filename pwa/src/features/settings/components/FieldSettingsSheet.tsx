import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useState, type FormEvent } from 'react';
import { apiClient } from '../../../app/services';
import { isNetworkError } from '../../../api/errors';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useSession } from '../../auth/hooks/useSession';
import { saveFieldSettings, type FieldSettingsPatch } from '../api/businessApi';
import { checkSettings, draftOf, type SettingsDraft } from '../model/settingsForm';
import { useUnits } from '../useUnits';
import '../settings.css';

/**
 * The owner's units (µm or mil, °C or °F) and drive-time factors. Settings live on the server,
 * so saving needs a signal; the field screens keep working with the last settings meanwhile.
 */
export function FieldSettingsSheet({ isOpen, onClose }: { isOpen: boolean; onClose: () => void }) {
  const units = useUnits();
  const businessId = useSession()?.user.businessId ?? '';
  const client = useQueryClient();
  const [draft, setDraft] = useState<SettingsDraft>(() => draftOf(units));
  const [tried, setTried] = useState(false);
  const check = checkSettings(draft);
  const save = useMutation({
    mutationFn: (patch: FieldSettingsPatch) => saveFieldSettings(apiClient, patch),
    // With no signal, say so at once rather than wait paused (and "Saving…") for one.
    networkMode: 'always',
    onSuccess: (business) => {
      client.setQueryData(['business', businessId], business);
      onClose();
    },
  });

  function submit(event: FormEvent) {
    event.preventDefault();
    setTried(true);
    if (check.patch) save.mutate(check.patch);
  }

  const problem = save.error
    ? isNetworkError(save.error)
      ? 'No signal: settings are kept on the server, so they can only change with a signal. Try again when you have one.'
      : save.error.message
    : null;

  return (
    <IonModal
      isOpen={isOpen}
      onWillPresent={() => {
        setDraft(draftOf(units));
        setTried(false);
        save.reset();
      }}
      onDidDismiss={onClose}
      aria-label="Units and drive times"
    >
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id="pp-settings-title" className="pp-header__title">
              Units and drive times
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <form
          className="pp-page pp-settings"
          aria-label="Units and drive times"
          noValidate
          onSubmit={submit}
        >
          <fieldset className="pp-settings__choice">
            <legend className="pp-field__label">Paint thickness in</legend>
            {(
              [
                ['um', 'micrometres (µm)'],
                ['mil', 'mils (thousandths of an inch)'],
              ] as const
            ).map(([value, words]) => (
              <label key={value} className="pp-settings__option">
                <input
                  type="radio"
                  name="thickness"
                  checked={draft.thickness === value}
                  onChange={() => setDraft((d) => ({ ...d, thickness: value }))}
                />
                <span>{words}</span>
              </label>
            ))}
          </fieldset>
          <fieldset className="pp-settings__choice">
            <legend className="pp-field__label">Temperatures in</legend>
            {(
              [
                ['C', 'degrees Celsius (°C)'],
                ['F', 'degrees Fahrenheit (°F)'],
              ] as const
            ).map(([value, words]) => (
              <label key={value} className="pp-settings__option">
                <input
                  type="radio"
                  name="temperature"
                  checked={draft.temperature === value}
                  onChange={() => setDraft((d) => ({ ...d, temperature: value }))}
                />
                <span>{words}</span>
              </label>
            ))}
          </fieldset>
          <TextField
            label="Road factor"
            hint="Road distance ÷ straight-line distance between two addresses: about 1.3 in town."
            inputMode="decimal"
            autoComplete="off"
            value={draft.roadFactor}
            onChange={(e) => setDraft((d) => ({ ...d, roadFactor: e.target.value }))}
            problem={tried ? check.problems.roadFactor : null}
          />
          <TextField
            label="Average driving speed (km/h)"
            hint="Door to door, with junctions and parking."
            inputMode="decimal"
            autoComplete="off"
            value={draft.averageKmh}
            onChange={(e) => setDraft((d) => ({ ...d, averageKmh: e.target.value }))}
            problem={tried ? check.problems.averageKmh : null}
          />
          <p className="pp-settings__note">
            Drive times are rough estimates from the map positions of the addresses; these two
            figures are rules of thumb to set from your own days.
          </p>
          {problem ? <Notice tone="stop">{problem}</Notice> : null}
          <div className="pp-actions">
            <button type="submit" className="pp-button" disabled={save.isPending}>
              {save.isPending ? 'Saving…' : 'Save settings'}
            </button>
          </div>
        </form>
      </IonContent>
    </IonModal>
  );
}
