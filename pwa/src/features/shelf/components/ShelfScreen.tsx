import { searchOutline } from 'ionicons/icons';
import { useDeferredValue, useId, useMemo, useState } from 'react';
import { EmptyState } from '../../../components/EmptyState';
import { Notice } from '../../../components/Notice';
import { useSession } from '../../auth/hooks/useSession';
import { useProducts } from '../hooks/useShelf';
import { shelfView } from '../model/shelf';
import { ProductLink } from './ProductLink';
import { ProductSheet } from './ProductSheet';
import '../../prep/kit/stageKit.css';
import '../shelf.css';
import { Icon } from '../../../components/Icon';

/**
 * The Shelf: products and tools with what is left of each — the low-stock list first, then
 * every product by kind. The owner adds products here (offline too); a helper looks.
 */
export default function ShelfScreen() {
  const products = useProducts();
  const isOwner = useSession()?.user.role === 'owner';
  const [query, setQuery] = useState('');
  const deferred = useDeferredValue(query);
  const [adding, setAdding] = useState(false);
  const searchId = useId();
  const view = useMemo(() => shelfView(products ?? [], deferred), [products, deferred]);

  if (products === undefined) return <div className="pp-loading" aria-busy="true" />;

  const add = isOwner ? (
    <button type="button" className="pp-button" onClick={() => setAdding(true)}>
      Add a product
    </button>
  ) : null;

  return (
    <div className="pp-office">
      {products.length === 0 ? (
        <EmptyState title="Nothing on the Shelf yet">
          <p>
            Compounds, polishes, solvents, tape, touch-up paint, coatings, pads and tools, with what
            is left of each and what the timers need to know about them.
          </p>
        </EmptyState>
      ) : (
        <>
          <div className="pp-field pp-office-search">
            <label className="pp-field__label" htmlFor={searchId}>
              Search the Shelf
            </label>
            <div className="pp-field__control">
              <Icon className="pp-office-search__icon" icon={searchOutline} />
              <input
                id={searchId}
                className="pp-field__input"
                type="search"
                enterKeyHint="search"
                autoComplete="off"
                placeholder="Name or kind"
                value={query}
                onChange={(e) => setQuery(e.target.value)}
              />
            </div>
          </div>
          <p className="pp-office-count" role="status">
            {view.total === products.length
              ? `${products.length} ${products.length === 1 ? 'product' : 'products'}`
              : `${view.total} of ${products.length} products`}
            {view.low.length ? ` · ${view.low.length} low on stock` : ''}
          </p>
        </>
      )}

      {add}

      {view.low.length ? (
        <section className="pp-office-section" aria-labelledby="pp-shelf-low">
          <h2 id="pp-shelf-low" className="pp-office-section__title">
            Low on stock
          </h2>
          <ul className="pp-office-list" aria-label="Low on stock">
            {view.low.map((p) => (
              <li key={p.id}>
                <ProductLink product={p} />
              </li>
            ))}
          </ul>
        </section>
      ) : products.length ? (
        <Notice tone="done">Nothing is low on stock.</Notice>
      ) : null}

      {view.groups.map((g) => (
        <section
          key={g.kind}
          className="pp-office-section"
          aria-labelledby={`pp-shelf-kind-${g.kind}`}
        >
          <h2 id={`pp-shelf-kind-${g.kind}`} className="pp-office-section__title">
            {g.title}
          </h2>
          <ul className="pp-office-list" aria-label={g.title}>
            {g.products.map((p) => (
              <li key={p.id}>
                <ProductLink product={p} />
              </li>
            ))}
          </ul>
        </section>
      ))}
      {products.length > 0 && view.total === 0 ? (
        <EmptyState title="No product matches">
          <p>Try fewer letters, or the kind (“solvent”, “pad”).</p>
        </EmptyState>
      ) : null}

      {isOwner ? (
        <ProductSheet isOpen={adding} onClose={() => setAdding(false)} product={null} />
      ) : null}
    </div>
  );
}
