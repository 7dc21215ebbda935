import type { JobRow } from '@panelpass/shared';
import { useRow } from '../../../db/hooks';
import { Notice } from '../../../components/Notice';
import { useSession } from '../../auth/hooks/useSession';
import { useThisSpot } from '../hooks/useThisSpot';
import { spotOf, spotWords } from '../model/spot';

/**
 * Where the car is, for the drive times of the day: the stored point of the job (and its
 * customer's), and for the owner on an open job "Use this spot" to take it from the phone.
 */
export function JobSpot({ job }: { job: JobRow }) {
  const customer = useRow('customers', job.customerId);
  const owner = useSession()?.user.role === 'owner';
  const { spot, storeHere } = useThisSpot(job, customer);
  const jobSpot = spotOf(job);
  const customerSpot = spotOf(customer);
  const canSet = owner && job.stage !== 'closed';
  const title = `pp-spot-title-${job.id}`;

  return (
    <section className="pp-ws-spot" aria-labelledby={title}>
      <h2 id={title} className="pp-ws-section-title">
        Where the car is
      </h2>
      <dl className="pp-ws-facts">
        <dt>This job</dt>
        <dd>{jobSpot ? spotWords(jobSpot) : 'No spot stored yet.'}</dd>
        {customer ? (
          <>
            <dt>Customer</dt>
            <dd>{customerSpot ? spotWords(customerSpot) : 'No spot stored yet.'}</dd>
          </>
        ) : null}
      </dl>
      {spot.state === 'stored' ? (
        <Notice tone="done">
          Spot stored: {spotWords(spot.spot)}
          {spot.customerToo ? ', for the customer too' : ''}. It is sent with the next sync.
        </Notice>
      ) : null}
      {spot.state === 'failed' ? <Notice tone="stop">{spot.problem}</Notice> : null}
      {canSet ? (
        <>
          <p className="pp-section-hint">
            At the car? Store where this phone is now, so drive times to this job are right.
          </p>
          <button
            type="button"
            className="pp-button pp-button--quiet-go"
            disabled={spot.state === 'finding'}
            onClick={storeHere}
          >
            {spot.state === 'finding' ? 'Finding where this phone is…' : 'Use this spot'}
          </button>
        </>
      ) : null}
    </section>
  );
}
