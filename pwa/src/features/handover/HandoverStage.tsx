import type { StageScreenProps } from '../workspace/stageScreens';
import { AcceptanceSignature } from './components/AcceptanceSignature';
import { AcceptanceView } from './components/AcceptanceView';
import { PaymentPanel } from './components/PaymentPanel';
import { useHandover } from './hooks/useHandover';
import '../walkaround/walkaround.css';
import './handover.css';

/**
 * The end of the visit: the summary of the work done, the customer's acceptance signature over
 * exactly that summary, the amount due and the payment (cash or cheque on the phone, a card
 * on the customer's own phone). The job closes on the server once it is paid in full; the
 * phone learns it at the next sync.
 */
export default function HandoverStage({ jobId }: StageScreenProps) {
  const data = useHandover(jobId);
  if (data === undefined) return <div className="pp-loading pp-ws-loading" aria-busy="true" />;
  if (data === null) return null;
  const h = (part: string) => `pp-hand-${part}-${jobId}`;

  return (
    <div className="pp-hand">
      <section className="pp-walk__section" aria-labelledby={h('work')}>
        <h2 id={h('work')} className="pp-ws-section-title">
          Work done
        </h2>
        <AcceptanceView record={data.record} />
      </section>
      <section className="pp-walk__section" aria-labelledby={h('sign')}>
        <h2 id={h('sign')} className="pp-ws-section-title">
          Customer&apos;s acceptance
        </h2>
        <AcceptanceSignature data={data} />
      </section>
      <section className="pp-walk__section" aria-labelledby={h('pay')}>
        <h2 id={h('pay')} className="pp-ws-section-title">
          Payment
        </h2>
        <PaymentPanel data={data} />
      </section>
    </div>
  );
}
