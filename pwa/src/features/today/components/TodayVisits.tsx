import { carOutline, warningOutline } from 'ionicons/icons';
import { Fragment } from 'react';
import { EmptyState } from '../../../components/EmptyState';
import { JobCard } from '../../jobs/components/JobCard';
import type { JobSummary } from '../../jobs/model/jobSummary';
import type { DriveSettings } from '@panelpass/shared';
import { dayLegs } from '../model/dayPlan';
import { Icon } from '../../../components/Icon';

/** One formatter for every visit's times, made once (it is costly to make). */
let timeFormat: Intl.DateTimeFormat | null = null;

function time(ms: number): string {
  timeFormat ??= new Intl.DateTimeFormat(undefined, { hour: '2-digit', minute: '2-digit' });
  return timeFormat.format(ms);
}

/**
 * The day's visits in order of their start, each with its time window, stage, car, owner and
 * address, and between them the drive from the previous stop.
 */
export function TodayVisits({
  visits,
  drive,
  driveSource,
  onChangeDrive,
}: {
  visits: readonly JobSummary[];
  drive: DriveSettings;
  driveSource: string;
  /** The owner may change the factors (Settings). */
  onChangeDrive?: (() => void) | undefined;
}) {
  const legs = dayLegs(visits, drive);
  return (
    <section className="pp-today__section" aria-labelledby="pp-today-visits">
      <h2 id="pp-today-visits" className="pp-today__heading">
        Today&apos;s visits
      </h2>
      {visits.length === 0 ? (
        <EmptyState title="No visits today">
          <p>Visits booked for today show up here in order, with the drive between them.</p>
        </EmptyState>
      ) : (
        <>
          <ol className="pp-visits">
            {visits.map((v, i) => {
              const leg = legs[i];
              return (
                <Fragment key={v.job.id}>
                  {leg && leg.kind !== 'first' ? (
                    <li className="pp-leg" aria-label="Drive">
                      <Icon icon={carOutline} />
                      <span>
                        {leg.words}
                        {leg.kind === 'drive' && leg.tight ? (
                          <span className="pp-leg__tight">
                            <Icon icon={warningOutline} />
                            {leg.tight}
                          </span>
                        ) : null}
                      </span>
                    </li>
                  ) : null}
                  <li className="pp-visits__visit">
                    <JobCard summary={v} when={`${time(v.startMs)}–${time(v.endMs)}`} />
                  </li>
                </Fragment>
              );
            })}
          </ol>
          {visits.length > 1 ? (
            <p className="pp-today__note">
              Drive times are estimates from the map positions: straight-line distance ×{' '}
              {drive.roadFactor} for the roads, at {drive.averageKmh} km/h ({driveSource}).
            </p>
          ) : null}
          {onChangeDrive ? (
            <button type="button" className="pp-link pp-today__change" onClick={onChangeDrive}>
              Change units and drive times
            </button>
          ) : null}
        </>
      )}
    </section>
  );
}
