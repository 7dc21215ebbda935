import { IonIcon } from '@ionic/react';
import { STAGE_LABELS, type JobStage } from '@panelpass/shared';
import { STAGE_ICONS } from '../model/stageLook';
import './jobs.css';

/** A job's stage: its word and icon (never colour alone). */
export function StageTag({ stage }: { stage: JobStage }) {
  return (
    <span className={`pp-stage-tag pp-stage-tag--${stage}`}>
      <IonIcon icon={STAGE_ICONS[stage]} aria-hidden="true" />
      <span>
        <span className="pp-stage-tag__hidden">Stage: </span>
        {STAGE_LABELS[stage]}
      </span>
    </span>
  );
}
