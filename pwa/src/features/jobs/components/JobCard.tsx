import { chevronForwardOutline, locationOutline } from 'ionicons/icons';
import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { JobSummary } from '../model/jobSummary';
import { StageTag } from './StageTag';
import './jobs.css';
import { Icon } from '../../../components/Icon';

/**
 * One visit as a card that opens its workspace: when, the stage (word and icon), the car,
 * its owner and the address. `when` is the time window in words.
 */
export function JobCard({
  summary,
  when,
  children,
}: {
  summary: JobSummary;
  when: string;
  children?: ReactNode;
}) {
  const { job } = summary;
  return (
    <Link className="pp-job-card" to={`/jobs/${job.id}`}>
      <span className="pp-job-card__top">
        <span className="pp-job-card__when">{when}</span>
        <StageTag stage={summary.stage} />
      </span>
      <span className="pp-job-card__vehicle">{summary.vehicleName}</span>
      {summary.vehicleDetails ? (
        <span className="pp-job-card__details">{summary.vehicleDetails}</span>
      ) : null}
      <span className="pp-job-card__customer">{summary.customerName}</span>
      {job.address ? (
        <span className="pp-job-card__address">
          <Icon icon={locationOutline} />
          <span>{job.address}</span>
        </span>
      ) : null}
      {children}
      <Icon className="pp-job-card__go" icon={chevronForwardOutline} />
    </Link>
  );
}
