import { JOB_STAGES, type JobStage } from '@panelpass/shared';
import { matchesSearch, startOfLocalDay, type JobSummary } from './jobSummary';

export type StageFilter = JobStage | 'all';

export interface DayGroup {
  dayMs: number;
  /** "Today", "Tomorrow", "Yesterday" or "Fri 8 May". */
  title: string;
  jobs: JobSummary[];
}

function dayTitle(dayMs: number, todayMs: number, locale?: string): string {
  const days = Math.round((dayMs - todayMs) / 86_400_000);
  if (days === 0) return 'Today';
  if (days === 1) return 'Tomorrow';
  if (days === -1) return 'Yesterday';
  const date = new Date(dayMs);
  const sameYear = date.getFullYear() === new Date(todayMs).getFullYear();
  return date.toLocaleDateString(locale, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
    ...(sameYear ? {} : { year: 'numeric' }),
  });
}

/**
 * The jobs list: visits of the picked stage matching the search, grouped by the local day of
 * their window, newest day first, and by start time within a day.
 */
export function listJobs(
  jobs: readonly JobSummary[],
  stage: StageFilter,
  query: string,
  nowMs: number,
  locale?: string,
): DayGroup[] {
  const shown = jobs.filter(
    (j) => (stage === 'all' || j.stage === stage) && matchesSearch(j, query),
  );
  const groups = new Map<number, JobSummary[]>();
  for (const j of shown) {
    const day = startOfLocalDay(j.startMs);
    groups.set(day, [...(groups.get(day) ?? []), j]);
  }
  const today = startOfLocalDay(nowMs);
  return [...groups.entries()]
    .sort(([a], [b]) => b - a)
    .map(([dayMs, list]) => ({
      dayMs,
      title: dayTitle(dayMs, today, locale),
      jobs: list.sort((a, b) => a.startMs - b.startMs),
    }));
}

/** How many visits are in each stage (for the filter chips). */
export function stageCounts(jobs: readonly JobSummary[]): Record<StageFilter, number> {
  const counts = { all: jobs.length } as Record<StageFilter, number>;
  for (const s of JOB_STAGES) counts[s] = 0;
  for (const j of jobs) counts[j.stage] += 1;
  return counts;
}
