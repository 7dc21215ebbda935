/**
 * Photos from the camera, made smaller on the phone and kept with the job (before, damage,
 * after). Reused by the walkaround (before and damage photos) and the finish (after photos):
 *
 *   <PhotoCapture jobId={jobId} kind="after" />
 *   <PhotoStrip photos={useJobPhotos(jobId, { kinds: ['after'] })} label="After photos" />
 */
export { PhotoCapture, type PhotoCaptureProps } from './PhotoCapture';
export { PhotoPicker } from './PhotoPicker';
export { IMAGE_WORDS, PhotoImage, PhotoStrip, photoName } from './PhotoStrip';
export {
  useImage,
  useImageUrl,
  type ImageStatus,
  type ImageView,
  useJobPhotos,
  selectPhotos,
  type PhotoFilter,
  type PhotoKind,
} from './usePhotos';
export type { ResizedImage } from './resizeImage';
