import type { StageScreenProps } from '../workspace/stageScreens';

/** The Chips stage of a job (placeholder until its screen is built). */
export default function ChipsStage({ jobId }: StageScreenProps) {
  return (
    <section aria-label="Chips" data-job={jobId}>
      <p>Chips is not built yet.</p>
    </section>
  );
}
