import { Cautions, type CautionKind } from '../../../components/Cautions';

export interface SdsProduct {
  name: string;
  sdsUrl: string | null;
}

/**
 * The usual cautions of a kind of work (the app's Cautions) for the products in use: the
 * first product's safety data sheet in the cautions, the others' sheets linked below.
 */
export function ProductCautions({
  kind,
  products,
}: {
  kind: CautionKind;
  products: readonly SdsProduct[];
}) {
  const seen = new Set<string>();
  const distinct = products.filter((p) => (seen.has(p.name) ? false : (seen.add(p.name), true)));
  const [first, ...others] = distinct;
  return (
    <div className="pp-stage-cautions">
      <Cautions kind={kind} sdsUrl={first?.sdsUrl ?? null} productName={first?.name ?? null} />
      {others.length > 0 ? (
        <ul className="pp-stage-sds" aria-label="More safety data sheets">
          {others.map((p) =>
            p.sdsUrl ? (
              <li key={p.name}>
                <a className="pp-link" href={p.sdsUrl} target="_blank" rel="noopener noreferrer">
                  Safety data sheet for {p.name} (opens outside the app)
                </a>
              </li>
            ) : (
              <li key={p.name} className="pp-stage-muted">
                No safety data sheet is linked for {p.name}: add it on the Shelf.
              </li>
            ),
          )}
        </ul>
      ) : null}
    </div>
  );
}
