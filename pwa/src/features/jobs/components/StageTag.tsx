import { STAGE_LABELS, type JobStage } from '@panelpass/shared';
import { STAGE_ICONS } from '../model/stageLook';
import './jobs.css';
import { Icon } from '../../../components/Icon';

/** A job's stage: its word and icon (never colour alone). */
export function StageTag({ stage }: { stage: JobStage }) {
  return (
    <span className={`pp-stage-tag pp-stage-tag--${stage}`}>
      <Icon icon={STAGE_ICONS[stage]} />
      <span>
        <span className="pp-stage-tag__hidden">Stage: </span>
        {STAGE_LABELS[stage]}
      </span>
    </span>
  );
}
