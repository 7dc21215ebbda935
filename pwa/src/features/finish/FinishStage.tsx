import type { StageScreenProps } from '../workspace/stageScreens';

/** The Finish stage of a job (placeholder until its screen is built). */
export default function FinishStage({ jobId }: StageScreenProps) {
  return (
    <section aria-label="Finish" data-job={jobId}>
      <p>Finish is not built yet.</p>
    </section>
  );
}
