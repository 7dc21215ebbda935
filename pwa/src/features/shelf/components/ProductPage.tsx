import { IonBackButton, IonPage } from '@ionic/react';
import { IonButtons, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { ProductRow } from '@panelpass/shared';
import { Cautions } from '../../../components/Cautions';
import { EmptyState } from '../../../components/EmptyState';
import { Notice } from '../../../components/Notice';
import { useSession } from '../../auth/hooks/useSession';
import { CoatingCautions } from '../../finish/components/CoatingCautions';
import { StateTag } from '../../prep/kit/StateTag';
import { SyncBadge } from '../../shell/components/SyncBadge';
import { useUnits } from '../../settings/useUnits';
import { useMoney } from '../hooks/useMoney';
import { useProduct, useStockMovements } from '../hooks/useShelf';
import { missingPropertiesWords, propertyLines } from '../model/productForm';
import { cautionFor, isLow, kindWords, lowWords, qtyText, usesLeft } from '../model/shelf';
import { ProductSheet } from './ProductSheet';
import { StockSheet } from './StockSheet';
import '../../prep/kit/stageKit.css';
import '../shelf.css';

const REASON_WORDS: Record<string, string> = {
  use: 'Used on a job',
  restock: 'Delivery',
  adjust: 'Count',
};

/**
 * One product: what is left (with the uses logged on this phone), its low-stock mark, what
 * the computations read from it, its safety data sheet with the usual cautions, and for the
 * owner its cost, recent stock changes, and the buttons to count, take a delivery or edit.
 */
export default function ProductPage() {
  const { id } = useParams<{ id: string }>();
  const product = useProduct(id);
  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonButtons slot="start">
            <IonBackButton
              defaultHref="/shelf"
              text=""
              aria-label="Back to the Shelf"
              className="pp-office-back"
            />
          </IonButtons>
          <div className="pp-header">
            <h1 className="pp-header__title">{product?.name ?? 'Product'}</h1>
            <div className="pp-header__tools">
              <SyncBadge />
            </div>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page">
          {product === undefined ? (
            <div className="pp-loading" aria-busy="true" />
          ) : product === null ? (
            <EmptyState title="This product is not on this phone">
              <p>
                It may have been removed from the Shelf.{' '}
                <Link className="pp-link" to="/shelf">
                  Back to the Shelf
                </Link>
              </p>
            </EmptyState>
          ) : (
            <ProductDetail product={product} />
          )}
        </div>
      </IonContent>
    </IonPage>
  );
}

function ProductDetail({ product }: { product: ProductRow }) {
  const isOwner = useSession()?.user.role === 'owner';
  const units = useUnits();
  const money = useMoney();
  const movements = useStockMovements(isOwner ? product.id : undefined);
  const [editing, setEditing] = useState(false);
  const [counting, setCounting] = useState(false);
  const low = isLow(product);
  const uses = usesLeft(product);
  const lines = propertyLines(product, (c) => units.formatTemp(c, 0));
  const missing = lines.length === 0 ? missingPropertiesWords(product.kind) : null;
  const caution = cautionFor(product.kind);

  return (
    <div className="pp-office">
      <section className="pp-office-section" aria-labelledby="pp-product-stock">
        <h2 id="pp-product-stock" className="pp-office-section__title">
          Stock
        </h2>
        <p className="pp-office-figure">
          {qtyText(product.stockQty)} {product.unit}
        </p>
        {low ? (
          <p>
            <StateTag
              tone={product.stockQty <= 0 ? 'stop' : 'wait'}
              words={lowWords(product) ?? 'Low'}
            />
          </p>
        ) : null}
        <dl className="pp-office-facts">
          <dt>Kind</dt>
          <dd>{kindWords(product.kind)}</dd>
          <dt>Used each time</dt>
          <dd>
            {product.amountPerUse > 0
              ? `${qtyText(product.amountPerUse)} ${product.unit}${uses !== null ? ` · enough for about ${uses} more` : ''}`
              : 'Not counted'}
          </dd>
          <dt>Low at</dt>
          <dd>
            {product.lowStockAt > 0
              ? `${qtyText(product.lowStockAt)} ${product.unit}`
              : 'No mark: low when none is left'}
          </dd>
          {product.unitCostMinor !== undefined ? (
            <>
              <dt>Cost</dt>
              <dd>
                {product.unitCostMinor > 0
                  ? `${money.unitCost(product.unitCostMinor)} per ${product.unit}`
                  : 'Not entered'}
              </dd>
            </>
          ) : null}
        </dl>
        {product.version === 0 ? (
          <Notice tone="info">Made on this phone: it goes to the server with the next sync.</Notice>
        ) : null}
        {isOwner ? (
          <div className="pp-office-buttons">
            <button type="button" className="pp-button" onClick={() => setCounting(true)}>
              Delivery or count
            </button>
            <button
              type="button"
              className="pp-button pp-button--quiet"
              onClick={() => setEditing(true)}
            >
              Change details
            </button>
          </div>
        ) : null}
      </section>

      <section className="pp-office-section" aria-labelledby="pp-product-sheet">
        <h2 id="pp-product-sheet" className="pp-office-section__title">
          From the data sheet
        </h2>
        {lines.length ? (
          <dl className="pp-office-facts">
            {lines.map((l) => (
              <div key={l.label} style={{ display: 'contents' }}>
                <dt>{l.label}</dt>
                <dd>{l.value}</dd>
              </div>
            ))}
          </dl>
        ) : missing ? (
          <Notice tone="wait">{missing}</Notice>
        ) : (
          <p className="pp-stage-muted">Nothing the timers need for this kind.</p>
        )}
        {caution === 'coating' ? (
          <CoatingCautions productName={product.name} sdsUrl={product.sdsUrl} />
        ) : caution ? (
          <Cautions kind={caution} sdsUrl={product.sdsUrl} productName={product.name} />
        ) : product.sdsUrl ? (
          <a className="pp-link" href={product.sdsUrl} target="_blank" rel="noopener noreferrer">
            Safety data sheet for {product.name} (opens outside the app)
          </a>
        ) : null}
      </section>

      {isOwner && movements && movements.length ? (
        <section className="pp-office-section" aria-labelledby="pp-product-moves">
          <h2 id="pp-product-moves" className="pp-office-section__title">
            Recent stock changes
          </h2>
          <div className="pp-office-scroll">
            <table className="pp-office-table">
              <thead>
                <tr>
                  <th scope="col">When</th>
                  <th scope="col">What</th>
                  <th scope="col" className="pp-num">
                    {product.unit}
                  </th>
                </tr>
              </thead>
              <tbody>
                {movements.slice(0, 12).map((m) => (
                  <tr key={m.id}>
                    <td>{new Date(m.createdAt).toLocaleDateString()}</td>
                    <td>
                      {REASON_WORDS[m.reason] ?? m.reason}
                      {m.version === 0 ? ' (waiting to send)' : ''}
                    </td>
                    <td className="pp-num">
                      {m.qty > 0 ? '+' : '−'}
                      {qtyText(Math.abs(m.qty))}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      ) : null}

      {isOwner ? (
        <>
          <ProductSheet isOpen={editing} onClose={() => setEditing(false)} product={product} />
          <StockSheet isOpen={counting} onClose={() => setCounting(false)} product={product} />
        </>
      ) : null}
    </div>
  );
}
