import type { StageScreenProps } from '../workspace/stageScreens';

/** The Handover stage of a job (placeholder until its screen is built). */
export default function HandoverStage({ jobId }: StageScreenProps) {
  return (
    <section aria-label="Handover" data-job={jobId}>
      <p>Handover is not built yet.</p>
    </section>
  );
}
