import { IonIcon } from '@ionic/react';
import { documentTextOutline, warningOutline } from 'ionicons/icons';

/**
 * The usual safety cautions of a stage, in our own words, with the product's safety data
 * sheet one tap away. They point to the sheet rather than replace it: the sheet, local codes
 * and licensed practice come first.
 */
export type CautionKind = 'solvent' | 'touch-up' | 'protection' | 'rotary';

export const CAUTIONS: Record<CautionKind, { headline: string; points: string[] }> = {
  solvent: {
    headline: 'Solvents: gloves, eye protection, fresh air.',
    points: [
      'Chemical-resistant gloves and eye protection while spraying and wiping.',
      'Work in moving air; wear a respirator if the safety data sheet calls for one.',
      'Not on a hot panel, never near a flame or a running heater; flush with water before it dries.',
    ],
  },
  'touch-up': {
    headline: 'Touch-up paint may contain isocyanates: the right gloves and mask.',
    points: [
      'Touch-up paints and clear coats may contain isocyanates: wear the gloves and the respiratory protection the safety data sheet names.',
      'Eye protection; keep the lid on between layers and work with air moving.',
      'Keep paint off the skin; clean brushes and spills as the sheet says.',
    ],
  },
  protection: {
    headline: 'Coatings: gloves, eye protection, fresh air.',
    points: [
      'Protection coatings carry solvents and some contain isocyanates: gloves and respiratory protection as the safety data sheet says.',
      'Eye protection; applicators and wipes go into a closed bag, not an open bin.',
    ],
  },
  rotary: {
    headline: 'Rotary machine: mind edges, cord and power.',
    points: [
      'Keep the spinning pad off edges, body lines and raised trim — clear coat is thinnest there and burns through first; tape them off.',
      'Cord over the shoulder, away from the pad; never let the machine run on the ground.',
      'Outdoor power only through an RCD/GFCI; keep plugs out of puddles and rinse water.',
    ],
  },
};

export interface SdsLink {
  name: string;
  sdsUrl: string | null;
}

export function StageCautions({
  kind,
  products = [],
}: {
  kind: CautionKind;
  /** Products whose safety data sheets to link (each once). */
  products?: readonly SdsLink[];
}) {
  const { headline, points } = CAUTIONS[kind];
  const seen = new Set<string>();
  const sheets = products.filter((p) => (seen.has(p.name) ? false : (seen.add(p.name), true)));
  return (
    <aside className="pp-cautions" aria-label="Safety">
      <details>
        <summary className="pp-cautions__summary">
          <IonIcon icon={warningOutline} aria-hidden="true" />
          <span>{headline}</span>
        </summary>
        <ul className="pp-cautions__points">
          {points.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      </details>
      {sheets.length > 0 ? (
        <ul className="pp-cautions__sheets">
          {sheets.map((p) =>
            p.sdsUrl ? (
              <li key={p.name}>
                <a className="pp-link" href={p.sdsUrl} target="_blank" rel="noopener noreferrer">
                  <IonIcon icon={documentTextOutline} aria-hidden="true" />
                  <span>Safety data sheet: {p.name}</span>
                </a>
              </li>
            ) : (
              <li key={p.name} className="pp-cautions__none">
                No safety data sheet link for {p.name} on the Shelf: read the printed sheet.
              </li>
            ),
          )}
        </ul>
      ) : null}
      <p className="pp-cautions__defer">
        The safety data sheet, local codes and licensed practice come first.
      </p>
    </aside>
  );
}
