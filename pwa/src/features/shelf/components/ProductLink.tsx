import { chevronForwardOutline } from 'ionicons/icons';
import { Link } from 'react-router-dom';
import type { ProductRow } from '@panelpass/shared';
import { StateTag } from '../../prep/kit/StateTag';
import { isLow, kindWords, lowWords, stockWords } from '../model/shelf';
import { Icon } from '../../../components/Icon';

/** One product as a row that opens its page: name, kind, stock left, and low in words. */
export function ProductLink({ product }: { product: ProductRow }) {
  const low = isLow(product);
  const out = product.stockQty <= 0;
  return (
    <Link
      className={`pp-office-row${low ? (out ? ' pp-office-row--out' : ' pp-office-row--low') : ''}`}
      to={`/shelf/${product.id}`}
    >
      <span className="pp-office-row__top">
        <span className="pp-office-row__name">{product.name}</span>
        {low ? <StateTag tone={out ? 'stop' : 'wait'} words={out ? 'Out' : 'Low'} /> : null}
      </span>
      <span className="pp-office-row__meta">{kindWords(product.kind)}</span>
      <span className="pp-office-row__figure">
        {stockWords(product)}
        {low && !out ? ` · ${lowWords(product)?.replace(/^Low: /, '') ?? ''}` : ''}
      </span>
      <Icon className="pp-office-row__go" icon={chevronForwardOutline} />
    </Link>
  );
}
