import { useState } from 'react';
import { Notice } from '../../components/Notice';
import { useChanges } from '../../sync/useChanges';
import type { PhotoKind } from './usePhotos';
import { PhotoPicker } from './PhotoPicker';

export interface PhotoCaptureProps {
  jobId: string;
  kind: PhotoKind;
  /** What the photo shows, e.g. a pin or a panel (optional). */
  subjectType?: 'pin' | 'panel' | 'chip' | 'pass' | 'reading' | 'solvent' | 'masking' | 'checklist';
  subjectId?: string;
  caption?: string;
  label?: string;
  quiet?: boolean;
  /** Called with the new photo's id once it is kept on the phone. */
  onAttached?: (photoId: string) => void;
}

/**
 * Take a photo and keep it with the job: made smaller on the phone (long edge 1600 px,
 * JPEG), stored at once, sent when there is a signal. Before, damage and after photos all
 * come through here.
 */
export function PhotoCapture({
  jobId,
  kind,
  subjectType,
  subjectId,
  caption,
  label,
  quiet,
  onAttached,
}: PhotoCaptureProps) {
  const recorder = useChanges();
  const [busy, setBusy] = useState(false);
  const [said, setSaid] = useState<{ tone: 'done' | 'stop'; words: string } | null>(null);

  async function keep(file: File) {
    setBusy(true);
    setSaid(null);
    try {
      // Loaded when first needed: the canvas work is not on any screen's first paint.
      const { resizeImage } = await import('./resizeImage');
      const image = await resizeImage(file);
      const id = crypto.randomUUID();
      const stored = await recorder.attachPhoto({
        id,
        jobId,
        kind,
        ...(subjectType && subjectId ? { subjectType, subjectId } : {}),
        ...(caption ? { caption } : {}),
        data: image.data,
        mime: image.mime,
        width: image.width,
        height: image.height,
      });
      if (stored) {
        setSaid({ tone: 'done', words: 'Photo saved on this phone.' });
        onAttached?.(id);
      }
    } catch (error) {
      setSaid({
        tone: 'stop',
        words: error instanceof Error ? error.message : 'The photo was not saved. Try again.',
      });
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="pp-photo-capture">
      <PhotoPicker
        {...(label ? { label } : {})}
        {...(quiet ? { quiet } : {})}
        busy={busy}
        onPicked={(file) => void keep(file)}
      />
      {said ? <Notice tone={said.tone}>{said.words}</Notice> : null}
    </div>
  );
}
