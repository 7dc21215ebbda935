import type { JobRow } from '@panelpass/shared';
import { useJobRows } from '../../../db/hooks';
import { Notice } from '../../../components/Notice';
import { JobMoneySection } from '../../jobmoney/components/JobMoneySection';
import { JobSpot } from './JobSpot';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * A booked or closed job at a glance: the work asked for and what was recorded; for the
 * owner its money (deposit, payments, refunds); and where the car is.
 */
export function JobSummary({ job }: { job: JobRow }) {
  const pins = useJobRows('damage_pins', job.id);
  const readings = useJobRows('film_readings', job.id);
  const photos = useJobRows('photos', job.id);
  const signatures = useJobRows('signatures', job.id);
  const closed = job.stage === 'closed';

  return (
    <>
      <section className="pp-ws-summary" aria-labelledby="pp-ws-summary-title">
        <h2 id="pp-ws-summary-title" className="pp-ws-section-title">
          {closed ? 'Closed job' : 'Booked'}
        </h2>
        {closed ? (
          <Notice tone="done">This job is closed. Everything here is kept as it was.</Notice>
        ) : (
          <Notice tone="info">
            When you arrive, move the job to Walkaround to record the car&apos;s condition with the
            owner.
          </Notice>
        )}
        <dl className="pp-ws-facts">
          {job.services.length ? (
            <>
              <dt>Work</dt>
              <dd>{job.services.join(', ')}</dd>
            </>
          ) : null}
          {job.notes ? (
            <>
              <dt>Notes</dt>
              <dd>{job.notes}</dd>
            </>
          ) : null}
          {job.conditionNotes ? (
            <>
              <dt>Condition</dt>
              <dd>{job.conditionNotes}</dd>
            </>
          ) : null}
          <dt>Recorded</dt>
          <dd>
            {[
              plural(pins?.length ?? 0, 'damage pin', 'damage pins'),
              plural(readings?.length ?? 0, 'film reading spot', 'film reading spots'),
              plural(photos?.length ?? 0, 'photo', 'photos'),
              plural(signatures?.length ?? 0, 'signature', 'signatures'),
            ].join(' · ')}
          </dd>
        </dl>
      </section>
      <JobMoneySection job={job} />
      <JobSpot job={job} />
    </>
  );
}
