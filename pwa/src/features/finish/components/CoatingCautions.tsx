import { Glyph } from '../../../components/Glyph';
import '../../../components/cautions.css';

const LINES = [
  'Gloves and eye protection: coatings carry solvents that irritate skin and eyes.',
  'Some protection coatings contain isocyanates: keep the air moving and wear the respirator the safety data sheet names.',
  'Used applicators and towels go into a closed bag, not an open bin; keep the bottle away from heat and flames.',
];

/**
 * The usual cautions when protection goes on, in the look of the app's Cautions, with the
 * product's safety data sheet. They defer to the sheet, local codes and licensed practice.
 */
export function CoatingCautions({
  productName,
  sdsUrl,
}: {
  productName: string | null;
  sdsUrl: string | null;
}) {
  return (
    <aside className="pp-cautions" aria-labelledby="pp-coating-cautions">
      <h3 id="pp-coating-cautions" className="pp-cautions__title">
        <Glyph name="alert" />
        <span>Coatings: protect yourself</span>
      </h3>
      <ul className="pp-cautions__lines">
        {LINES.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
      {sdsUrl ? (
        <a className="pp-link" href={sdsUrl} target="_blank" rel="noopener noreferrer">
          Safety data sheet{productName ? ` for ${productName}` : ''} (opens outside the app)
        </a>
      ) : (
        <p className="pp-cautions__defer">
          No safety data sheet is linked for {productName ?? 'this product'}: add it on the Shelf.
        </p>
      )}
      <p className="pp-cautions__defer">
        The product’s safety data sheet, local codes and licensed practice come before these notes.
      </p>
    </aside>
  );
}
