import type { StageScreenProps } from '../workspace/stageScreens';

/** The Correction stage of a job (placeholder until its screen is built). */
export default function CorrectionStage({ jobId }: StageScreenProps) {
  return (
    <section aria-label="Correction" data-job={jobId}>
      <p>Correction is not built yet.</p>
    </section>
  );
}
