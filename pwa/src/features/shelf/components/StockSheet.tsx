import type { ProductRow } from '@panelpass/shared';
import { useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { TextField } from '../../../components/TextField';
import { useChanges } from '../../../sync/useChanges';
import { ChoiceField } from '../../prep/kit/fields';
import { parseDecimal } from '../../prep/kit/numbers';
import { Sheet } from '../../prep/kit/Sheet';
import { useMoney } from '../hooks/useMoney';
import { qtyText } from '../model/shelf';

type Way = 'restock' | 'count';

/** The stock change a delivery or a count makes, or what is wrong with what was typed. */
export function stockChange(
  way: Way,
  typed: string,
  stockQty: number,
): { qty: number } | { problem: string } {
  const n = parseDecimal(typed);
  if (n === null) return { problem: 'Type a number.' };
  if (Math.round(n * 1000) / 1000 !== n) return { problem: 'At most 3 decimals.' };
  if (way === 'restock') {
    if (!(n > 0)) return { problem: 'A delivery adds: type how much came, above 0.' };
    return { qty: n };
  }
  if (n < 0) return { problem: 'A count cannot be below 0.' };
  const qty = Math.round((n - stockQty) * 1000) / 1000;
  if (qty === 0) return { problem: 'That is what the Shelf already says: nothing to change.' };
  return { qty };
}

/**
 * A delivery (adds to stock, and its price per unit becomes the product's cost) or a count
 * of what is really on the shelf (the difference is recorded). The owner's; offline too.
 */
export function StockSheet({
  isOpen,
  onClose,
  product,
}: {
  isOpen: boolean;
  onClose: () => void;
  product: ProductRow;
}) {
  const { changes } = useChanges();
  const money = useMoney();
  const [way, setWay] = useState<Way>('restock');
  const [amount, setAmount] = useState('');
  const [cost, setCost] = useState('');
  const [tried, setTried] = useState(false);
  const [saving, setSaving] = useState(false);

  useEffect(() => {
    if (!isOpen) return;
    setTried(false);
    setAmount('');
    setCost('');
  }, [isOpen]);

  const change = stockChange(way, amount, product.stockQty);
  const typedCost = cost.trim() === '' ? null : parseDecimal(cost);
  const costProblem =
    way === 'restock' && cost.trim() !== '' && (typedCost === null || typedCost < 0)
      ? 'Type the price of one unit, or leave it empty.'
      : null;

  async function save() {
    setTried(true);
    if ('problem' in change || costProblem) return;
    setSaving(true);
    const unitCostMinor =
      way === 'restock' && typedCost !== null
        ? Math.round(typedCost * 10 ** money.digits * 10_000) / 10_000
        : undefined;
    const done = await changes.adjustStock({
      id: crypto.randomUUID(),
      productId: product.id,
      qty: change.qty,
      reason: way === 'restock' ? 'restock' : 'adjust',
      ...(unitCostMinor === undefined ? {} : { unitCostMinor }),
    });
    setSaving(false);
    if (done) onClose();
  }

  const unit = product.unit;
  return (
    <Sheet
      isOpen={isOpen}
      onClose={onClose}
      title={`Stock of ${product.name}`}
      action={
        <button type="button" className="pp-button" disabled={saving} onClick={() => void save()}>
          {way === 'restock' ? 'Add the delivery' : 'Save the count'}
        </button>
      }
    >
      <p className="pp-office-figure">
        {qtyText(product.stockQty)} {unit}
      </p>
      <p className="pp-field__hint">On the Shelf now, with the uses logged on this phone.</p>
      <ChoiceField
        label="What happened"
        value={way}
        onChange={(v) => setWay(v === 'count' ? 'count' : 'restock')}
        columns={2}
        options={[
          { value: 'restock', label: 'A delivery came' },
          { value: 'count', label: 'I counted it' },
        ]}
      />
      <TextField
        label={way === 'restock' ? `How much came (${unit})` : `How much is there (${unit})`}
        inputMode="decimal"
        autoComplete="off"
        value={amount}
        onChange={(e) => setAmount(e.target.value)}
        problem={tried && 'problem' in change ? change.problem : null}
      />
      {way === 'restock' ? (
        <TextField
          label={`Price of one ${unit} this time (${money.currency})`}
          hint="Leave empty to keep the cost the Shelf has."
          inputMode="decimal"
          autoComplete="off"
          value={cost}
          onChange={(e) => setCost(e.target.value)}
          problem={tried ? costProblem : null}
        />
      ) : null}
      {'qty' in change && way === 'count' ? (
        <Notice tone="info">
          {change.qty > 0
            ? `${qtyText(change.qty)} ${unit} more`
            : `${qtyText(-change.qty)} ${unit} less`}{' '}
          than the Shelf says: the difference is recorded as a count.
        </Notice>
      ) : null}
    </Sheet>
  );
}
