import { checkmarkCircle, ellipseOutline } from 'ionicons/icons';
import { useJobRows } from '../../../db/hooks';
import { useChanges } from '../../../sync/useChanges';
import { Icon } from '../../../components/Icon';

/**
 * A stage's checklist of the job: one big row per step, ticked with one tap (and untickable
 * the same way). A ticked step shows a tick and "Done", not only a colour.
 */
export function Checklist({
  jobId,
  stage,
  title,
}: {
  jobId: string;
  stage: 'prep' | 'finish';
  title: string;
}) {
  const { changes } = useChanges();
  const rows = useJobRows('checklist_items', jobId, 'position');
  const items = (rows ?? []).filter((r) => r.stage === stage);
  const done = items.filter((r) => r.done).length;
  const headingId = `pp-check-${stage}`;
  return (
    <section className="pp-stage-section" aria-labelledby={headingId}>
      <div className="pp-stage-section__head">
        <h2 id={headingId} className="pp-stage-section__title">
          {title}
        </h2>
        <span className="pp-stage-section__count">
          {done} of {items.length} done
        </span>
      </div>
      {rows !== undefined && items.length === 0 ? (
        <p className="pp-stage-muted">No steps on this job’s list.</p>
      ) : null}
      <ul className="pp-checklist">
        {items.map((item) => (
          <li key={item.id}>
            <button
              type="button"
              role="checkbox"
              aria-checked={item.done}
              className={`pp-check${item.done ? ' pp-check--done' : ''}`}
              onClick={() => void changes.toggleCheck({ id: item.id, done: !item.done })}
            >
              <Icon className="pp-check__box" icon={item.done ? checkmarkCircle : ellipseOutline} />
              <span className="pp-check__text">
                <span className="pp-check__label">{item.label}</span>
                {item.done ? (
                  <span className="pp-check__state" aria-hidden="true">
                    Done
                  </span>
                ) : null}
              </span>
            </button>
          </li>
        ))}
      </ul>
    </section>
  );
}
