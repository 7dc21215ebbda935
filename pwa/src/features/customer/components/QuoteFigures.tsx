import type { QuoteFiguresRecord } from '../model/quoteRecord';

/**
 * A quote's lines and totals, drawn from the record alone: what the customer reads here is
 * exactly what their signature's fingerprint covers.
 */
export function QuoteFigures({ record, caption }: { record: QuoteFiguresRecord; caption: string }) {
  return (
    <table className="pp-cust-figures">
      <caption className="pp-cust-figures__caption">{caption}</caption>
      <thead>
        <tr>
          <th scope="col">What</th>
          <th scope="col" className="pp-cust-figures__amount">
            Price
          </th>
        </tr>
      </thead>
      <tbody>
        {record.lines.map((line, i) => (
          <tr key={i}>
            <td>{line.description}</td>
            <td className="pp-cust-figures__amount">{line.amount}</td>
          </tr>
        ))}
      </tbody>
      <tfoot>
        <tr>
          <th scope="row">Subtotal</th>
          <td className="pp-cust-figures__amount">{record.words.subtotal}</td>
        </tr>
        {record.discountMinor > 0 ? (
          <tr>
            <th scope="row">Discount</th>
            <td className="pp-cust-figures__amount">−{record.words.discount}</td>
          </tr>
        ) : null}
        <tr>
          <th scope="row">Tax</th>
          <td className="pp-cust-figures__amount">{record.words.tax}</td>
        </tr>
        <tr className="pp-cust-figures__total">
          <th scope="row">Total</th>
          <td className="pp-cust-figures__amount">{record.words.total}</td>
        </tr>
        {record.depositMinor > 0 ? (
          <tr>
            <th scope="row">Deposit to book</th>
            <td className="pp-cust-figures__amount">{record.words.deposit}</td>
          </tr>
        ) : null}
      </tfoot>
    </table>
  );
}
