import { cameraOutline } from 'ionicons/icons';
import { useId, type ChangeEvent } from 'react';
import './photos.css';
import { Icon } from '../../components/Icon';

/**
 * A big "Take a photo" button that opens the back camera (`capture="environment"`); on a
 * computer it opens the file chooser. The input itself stays focusable for keyboards and
 * screen readers, under its visible label.
 */
export function PhotoPicker({
  label = 'Take a photo',
  busy = false,
  quiet = false,
  onPicked,
}: {
  label?: string;
  busy?: boolean;
  /** A secondary look (outline) where another action is the main one. */
  quiet?: boolean;
  onPicked: (file: File) => void;
}) {
  const id = useId();
  function picked(event: ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    // Let the same picture be chosen again after a failure.
    event.target.value = '';
    if (file) onPicked(file);
  }
  return (
    <label
      htmlFor={id}
      className={`pp-photo-pick${quiet ? ' pp-photo-pick--quiet' : ''}${busy ? ' pp-photo-pick--busy' : ''}`}
    >
      <input
        id={id}
        className="pp-photo-pick__input"
        type="file"
        accept="image/*"
        capture="environment"
        disabled={busy}
        onChange={picked}
      />
      <Icon icon={cameraOutline} />
      <span>{busy ? 'Saving the photo…' : label}</span>
    </label>
  );
}
