import { useId } from 'react';
import { Glyph } from './Glyph';
import './cautions.css';

export type CautionKind = 'solvent' | 'touch-up' | 'machine' | 'power';

/** The usual cautions for each kind of work, in our own words. */
export const CAUTION_LINES: Record<CautionKind, { title: string; lines: readonly string[] }> = {
  solvent: {
    title: 'Solvents: protect yourself',
    lines: [
      'Chemical-resistant gloves and eye protection while you spray, wipe and flush.',
      'Work in moving air; wear a respirator when the safety data sheet calls for one.',
      'Keep it away from sparks, flames and hot panels, and keep the container closed.',
    ],
  },
  'touch-up': {
    title: 'Touch-up paint: protect yourself',
    lines: [
      'Gloves and eye protection: paint, hardener and thinner irritate skin and eyes.',
      'Some touch-up paints and clears contain isocyanates: keep the air moving and wear the respirator the safety data sheet names. People with asthma or a known sensitisation should not use them.',
      'Close the bottle between layers and keep it away from heat and flames.',
    ],
  },
  machine: {
    title: 'Machine polishing',
    lines: [
      'Keep the pad flat and off edges, badges and trim: a rotary grabs edges and cuts through quickly.',
      'Cord over your shoulder and behind you; stop the pad before you lift it off the paint.',
      'Eye protection; no loose sleeves, cords or hair near the spinning pad.',
    ],
  },
  power: {
    title: 'Outdoor power',
    lines: [
      'Plug in only through an RCD (GFCI) and press its test button before you start.',
      'Use outdoor-rated leads, unwound all the way; keep plugs and joints off wet ground and out of the rinse water.',
    ],
  },
};

export interface CautionsProps {
  kind: CautionKind;
  /** The product's safety data sheet, when it is known. */
  sdsUrl?: string | null;
  productName?: string | null;
}

/**
 * The usual safety cautions for a kind of work, with a link to the product's safety data
 * sheet when there is one. They defer to the data sheet, local codes and licensed practice.
 */
export function Cautions({ kind, sdsUrl, productName }: CautionsProps) {
  const { title, lines } = CAUTION_LINES[kind];
  const headingId = useId();
  return (
    <aside className="pp-cautions" aria-labelledby={headingId}>
      <h3 id={headingId} className="pp-cautions__title">
        <Glyph name="alert" />
        <span>{title}</span>
      </h3>
      <ul className="pp-cautions__lines">
        {lines.map((line) => (
          <li key={line}>{line}</li>
        ))}
      </ul>
      {sdsUrl ? (
        <a className="pp-link" href={sdsUrl} target="_blank" rel="noopener noreferrer">
          Safety data sheet{productName ? ` for ${productName}` : ''} (opens outside the app)
        </a>
      ) : kind === 'solvent' || kind === 'touch-up' ? (
        <p className="pp-cautions__defer">
          No safety data sheet is linked for {productName ?? 'this product'}: add it on the Shelf.
        </p>
      ) : null}
      <p className="pp-cautions__defer">
        {kind === 'power'
          ? 'Local electrical codes and a licensed electrician come before these notes.'
          : "The product's safety data sheet, local codes and licensed practice come before these notes."}
      </p>
    </aside>
  );
}
