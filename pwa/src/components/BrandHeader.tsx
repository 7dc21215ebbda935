import markUrl from '../assets/mark.svg';

/** The mark and name on the signed-out screens, with one line saying what this screen is for. */
export function BrandHeader({ title, lead }: { title: string; lead?: string }) {
  return (
    <header className="pp-brand">
      <div className="pp-brand__name">
        <img src={markUrl} alt="" width={48} height={48} />
        <span>Panelpass</span>
      </div>
      <h1 className="pp-brand__title">{title}</h1>
      {lead ? <p className="pp-brand__lead">{lead}</p> : null}
    </header>
  );
}
