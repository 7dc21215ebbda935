import {
  alertCircleOutline,
  brushOutline,
  checkmarkCircleOutline,
  layersOutline,
  timeOutline,
  waterOutline,
} from 'ionicons/icons';
import { Link } from 'react-router-dom';
import type { DueItem } from '../model/dueItems';
import { Icon } from '../../../components/Icon';

const KIND_ICON: Record<DueItem['kind'], string> = {
  flush: waterOutline,
  mask: layersOutline,
  chip: brushOutline,
};

const STATE_LOOK: Record<DueItem['state'], { word: string; icon: string }> = {
  overdue: { word: 'Overdue', icon: alertCircleOutline },
  ready: { word: 'Ready', icon: checkmarkCircleOutline },
  'due-soon': { word: 'Due soon', icon: timeOutline },
};

/**
 * What needs doing across jobs: each with its state (word and icon), what to do, how it
 * stands, and the job; tap to open the job.
 */
export function DueList({
  items,
  jobWords,
}: {
  items: readonly DueItem[];
  jobWords: (jobId: string) => string | undefined;
}) {
  return (
    <ul className="pp-due">
      {items.map((item) => {
        const look = STATE_LOOK[item.state];
        return (
          <li key={item.key}>
            <Link className={`pp-due__item pp-due__item--${item.state}`} to={`/jobs/${item.jobId}`}>
              <span className="pp-due__state">
                <Icon icon={look.icon} />
                {look.word}
              </span>
              <span className="pp-due__title">
                <Icon icon={KIND_ICON[item.kind]} />
                <span>{item.title}</span>
              </span>
              <span className="pp-due__detail">{item.detail}</span>
              {jobWords(item.jobId) ? (
                <span className="pp-due__job">{jobWords(item.jobId)}</span>
              ) : null}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
