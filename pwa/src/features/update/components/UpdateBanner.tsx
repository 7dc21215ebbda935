import { Glyph } from '../../../components/Glyph';
import { useAppUpdate } from '../hooks/useAppUpdate';

/** "A new version is ready — Reload", shown until the user chooses. */
export function UpdateBanner() {
  const { ready, reload, later } = useAppUpdate();
  if (!ready) return null;
  return (
    <div className="pp-update" role="status">
      <Glyph name="refresh" />
      <p className="pp-update__words">A new version is ready</p>
      <button type="button" className="pp-update__later" onClick={later}>
        Later
      </button>
      <button type="button" className="pp-update__reload" onClick={reload}>
        Reload
      </button>
    </div>
  );
}
