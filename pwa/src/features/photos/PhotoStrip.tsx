import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../components/ionic';
import { useState } from 'react';
import type { PhotoRow } from '@panelpass/shared';
import { useImage } from './usePhotos';
import './photos.css';

const KIND_WORDS: Record<string, string> = {
  before: 'Before',
  after: 'After',
  damage: 'Damage',
  other: 'Photo',
};

export function photoName(photo: PhotoRow): string {
  const at = new Date(photo.takenAt);
  const time = Number.isNaN(at.getTime())
    ? ''
    : ` at ${at.toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit' })}`;
  return `${KIND_WORDS[photo.kind] ?? 'Photo'} photo${time}${photo.caption ? `: ${photo.caption}` : ''}`;
}

/** Why a photo cannot be shown now, in words. */
export const IMAGE_WORDS = {
  offline: 'Photo is on the server; it will show when there is signal',
  missing: 'Photo is not on the server',
  error: 'Photo could not be loaded; it will be tried again',
} as const;

/**
 * One photo: this phone's copy, or downloaded from the server when another phone took it;
 * words in its place while it cannot be shown.
 */
export function PhotoImage({ photo, className }: { photo: PhotoRow; className?: string }) {
  const { status, url } = useImage(photo.sha256);
  if (status === 'loading')
    return <span className={`${className ?? ''} pp-photo--loading`} aria-hidden="true" />;
  if (status !== 'ready' || !url) {
    const words = status === 'ready' ? IMAGE_WORDS.error : IMAGE_WORDS[status];
    return (
      <span
        className={`${className ?? ''} pp-photo--missing`}
        role="img"
        aria-label={`${photoName(photo)}. ${words}`}
      >
        {words}
      </span>
    );
  }
  return (
    <img
      className={className}
      src={url}
      alt={photoName(photo)}
      width={photo.width}
      height={photo.height}
    />
  );
}

/**
 * A row of thumbnails (scrolls sideways); tap one to see it large. Empty: says so, in
 * words, so the row never looks broken.
 */
export function PhotoStrip({
  photos,
  label,
  empty = 'No photos yet.',
}: {
  photos: readonly PhotoRow[] | undefined;
  /** What the row shows, for screen readers ("Before photos"). */
  label: string;
  empty?: string;
}) {
  const [open, setOpen] = useState<PhotoRow | null>(null);
  if (!photos) return null;
  if (photos.length === 0) return <p className="pp-photo-strip__empty">{empty}</p>;
  return (
    <>
      <ul className="pp-photo-strip" aria-label={label}>
        {photos.map((photo) => (
          <li key={photo.id}>
            <button
              type="button"
              className="pp-photo-strip__thumb"
              aria-label={`Open ${photoName(photo)}`}
              onClick={() => setOpen(photo)}
            >
              <PhotoImage photo={photo} className="pp-photo-strip__img" />
            </button>
          </li>
        ))}
      </ul>
      <IonModal isOpen={open !== null} onDidDismiss={() => setOpen(null)} aria-label="Photo">
        <IonHeader>
          <IonToolbar>
            <div className="pp-header">
              <h2 className="pp-header__title">{open ? photoName(open) : 'Photo'}</h2>
              <IonButton className="pp-signout" fill="clear" onClick={() => setOpen(null)}>
                Close
              </IonButton>
            </div>
          </IonToolbar>
        </IonHeader>
        <IonContent>
          {open ? (
            <div className="pp-photo-view">
              <PhotoImage photo={open} className="pp-photo-view__img" />
            </div>
          ) : null}
        </IonContent>
      </IonModal>
    </>
  );
}
