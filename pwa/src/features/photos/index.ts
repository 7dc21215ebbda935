/**
 * Photos from the camera, made smaller on the phone and kept with the job (before, damage,
 * after). Reused by the walkaround (before and damage photos) and the finish (after photos):
 *
 *   <PhotoCapture jobId={jobId} kind="after" />
 *   <PhotoStrip photos={useJobPhotos(jobId, { kinds: ['after'] })} label="After photos" />
 */
export { PhotoCapture, type PhotoCaptureProps } from './PhotoCapture';
export { PhotoPicker } from './PhotoPicker';
export { PhotoImage, PhotoStrip, photoName } from './PhotoStrip';
export {
  useImageUrl,
  useJobPhotos,
  selectPhotos,
  type PhotoFilter,
  type PhotoKind,
} from './usePhotos';
export type { ResizedImage } from './resizeImage';
