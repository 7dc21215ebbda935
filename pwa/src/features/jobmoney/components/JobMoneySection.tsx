import type { JobRow } from '@panelpass/shared';
import { Notice } from '../../../components/Notice';
import { useSync } from '../../../sync/context';
import { useJobMoney } from '../hooks/useJobMoney';
import { refusalWords } from '../model/jobMoney';
import { DepositPanel } from './DepositPanel';
import { PaymentList } from './PaymentList';
import '../../walkaround/walkaround.css';
import '../../handover/handover.css';
import '../jobmoney.css';

/**
 * The job's money on its own page, for the owner: what is due, the deposit while it is
 * booked, and every payment with its refunds. A helper's phone has no prices or payments,
 * so there is nothing here for them.
 */
export function JobMoneySection({ job }: { job: JobRow }) {
  const money = useJobMoney(job);
  const sync = useSync();
  if (money === undefined) return <div className="pp-loading" aria-busy="true" />;
  const { due, currency } = money;
  if (!due) return null;
  // Cash the server refused after it was sent (a second phone took money meanwhile).
  const refused = sync?.status.rejected
    .filter((r) => r.name === 'payment.recordCash' && r.args.jobId === job.id)
    .at(-1);
  const title = `pp-money-title-${job.id}`;

  return (
    <section className="pp-money" aria-labelledby={title}>
      <h2 id={title} className="pp-ws-section-title">
        Money
      </h2>
      <p className={`pp-hand-due${due.settled ? ' pp-hand-due--settled' : ''}`} role="status">
        {due.words}
      </p>
      {refused ? (
        <Notice tone="stop">
          A cash or cheque payment was refused by the server:{' '}
          {refusalWords(refused.code, refused.message, refused.details, currency)} (It is listed
          under the sync badge.)
        </Notice>
      ) : null}
      {job.stage === 'booked' && !due.settled ? <DepositPanel money={money} /> : null}
      <PaymentList money={money} />
    </section>
  );
}
