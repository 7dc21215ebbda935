/**
 * index.html draws a splash (the mark and the promise) before any JavaScript runs; it sits under
 * the app. Once the first screen is in place this takes it out of the page, on the first frame
 * that screen is visible (Ionic shows a page after its first transition), giving up after
 * `maxFrames` frames so it never lingers. The first look is on the next frame, not at once: it
 * is called as the first screen mounts, and that task is long enough already.
 */
export function hideSplash(doc: Document = document, maxFrames = 180): void {
  const splash = doc.getElementById('pp-splash');
  if (!splash) return;
  let frames = 0;
  const pages = doc.getElementsByClassName('ion-page');
  const check = () => {
    const shown = Array.prototype.some.call(
      pages,
      (page: Element) => !page.classList.contains('ion-page-invisible'),
    );
    if (shown || ++frames >= maxFrames) splash.remove();
    else requestAnimationFrame(check);
  };
  requestAnimationFrame(check);
}
