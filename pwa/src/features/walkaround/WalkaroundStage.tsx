import type { StageScreenProps } from '../workspace/stageScreens';

/** The Walkaround stage of a job (placeholder until its screen is built). */
export default function WalkaroundStage({ jobId }: StageScreenProps) {
  return (
    <section aria-label="Walkaround" data-job={jobId}>
      <p>Walkaround is not built yet.</p>
    </section>
  );
}
