import type { StageScreenProps } from '../workspace/stageScreens';

/** The Prep stage of a job (placeholder until its screen is built). */
export default function PrepStage({ jobId }: StageScreenProps) {
  return (
    <section aria-label="Prep" data-job={jobId}>
      <p>Prep is not built yet.</p>
    </section>
  );
}
