import {
  allowedNextStages,
  isJobStage,
  JOB_STAGES,
  STAGE_LABELS,
  type JobStage,
} from '@panelpass/shared';

/** What the stage bar can show: a stage, or the chips (worked on beside prep and correction). */
export type WorkspaceView = JobStage | 'chips';

export type StepState = 'done' | 'current' | 'later' | 'beside';

export interface StageStep {
  view: WorkspaceView;
  label: string;
  state: StepState;
  /** The word under the label: the state never shows by colour alone. */
  stateWord: string;
}

const STATE_WORDS: Record<StepState, string> = {
  done: 'Done',
  current: 'Now',
  later: 'Later',
  beside: 'Any time',
};

/**
 * The steps of the stage bar for a job at `current`: stages before it done, it now, the rest
 * later; Chips sits after Correction as a step beside the line (done with prep and
 * correction, not a stage of its own).
 */
export function stageSteps(current: JobStage): StageStep[] {
  const at = JOB_STAGES.indexOf(current);
  const steps: StageStep[] = [];
  JOB_STAGES.forEach((stage, i) => {
    const state: StepState = i < at ? 'done' : i === at ? 'current' : 'later';
    // A closed job is finished: its last step is done, not "now".
    const shown: StepState = current === 'closed' && stage === 'closed' ? 'done' : state;
    steps.push({
      view: stage,
      label: STAGE_LABELS[stage],
      state: shown,
      stateWord: STATE_WORDS[shown],
    });
    if (stage === 'correction') {
      steps.push({ view: 'chips', label: 'Chips', state: 'beside', stateWord: STATE_WORDS.beside });
    }
  });
  return steps;
}

export function viewLabel(view: WorkspaceView): string {
  return view === 'chips' ? 'Chips' : STAGE_LABELS[view];
}

export interface StageMoves {
  /** The next stage forward, when the table allows one. */
  forward: JobStage | null;
  /** One stage back, to fix a slip. */
  back: JobStage | null;
}

/** The moves the stage table (shared `allowedNextStages`) allows from `current`. */
export function stageMoves(current: string): StageMoves {
  if (!isJobStage(current)) return { forward: null, back: null };
  const at = JOB_STAGES.indexOf(current);
  const allowed = allowedNextStages(current);
  return {
    forward: allowed.find((s) => JOB_STAGES.indexOf(s) > at) ?? null,
    back: allowed.find((s) => JOB_STAGES.indexOf(s) < at) ?? null,
  };
}

/** "Move to Prep"; closing gets its own words (it cannot be undone). */
export function forwardWords(to: JobStage): string {
  return to === 'closed' ? 'Close the job' : `Move to ${STAGE_LABELS[to]}`;
}

export function backWords(to: JobStage): string {
  return `Back to ${STAGE_LABELS[to]}`;
}

/** The job's stage as a JobStage (an unknown one is shown as booked, read only). */
export function stageOf(stage: string): JobStage {
  return isJobStage(stage) ? stage : 'booked';
}
