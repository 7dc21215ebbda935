/**
 * index.html draws a splash (the mark and the promise) before any JavaScript runs; it sits under
 * the app. Once the first screen is in place this takes it out of the page: at once when that
 * screen is already visible, else on the frame it becomes visible (Ionic shows a page after its
 * first transition), giving up after `maxFrames` frames so it never lingers.
 */
export function hideSplash(doc: Document = document, maxFrames = 180): void {
  const splash = doc.getElementById('pp-splash');
  if (!splash) return;
  let frames = 0;
  const check = () => {
    const shown = doc.querySelector('.ion-page:not(.ion-page-invisible)') !== null;
    if (shown || ++frames >= maxFrames) splash.remove();
    else requestAnimationFrame(check);
  };
  check();
}
