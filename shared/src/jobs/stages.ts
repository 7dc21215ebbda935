/**
 * The stages of a visit and the moves between them. Both the app (offline) and the server
 * (authoritatively) check a stage change here.
 */
export const JOB_STAGES = [
  'booked',
  'walkaround',
  'prep',
  'correction',
  'finish',
  'handover',
  'closed',
] as const;
export type JobStage = (typeof JOB_STAGES)[number];

export const STAGE_LABELS: Record<JobStage, string> = {
  booked: 'Booked',
  walkaround: 'Walkaround',
  prep: 'Prep',
  correction: 'Correction',
  finish: 'Finish',
  handover: 'Handover',
  closed: 'Closed',
};

export function isJobStage(v: unknown): v is JobStage {
  return typeof v === 'string' && (JOB_STAGES as readonly string[]).includes(v);
}

/**
 * Forward one stage at a time, or back one stage to fix a slip. A closed job stays closed
 * (a correction after closing is a new visit).
 */
export function allowedNextStages(from: JobStage): JobStage[] {
  if (from === 'closed') return [];
  const i = JOB_STAGES.indexOf(from);
  const next: JobStage[] = [];
  const forward = JOB_STAGES[i + 1];
  if (forward) next.push(forward);
  const back = JOB_STAGES[i - 1];
  if (back) next.push(back);
  return next;
}

export function canMoveStage(from: JobStage, to: JobStage): boolean {
  return allowedNextStages(from).includes(to);
}
