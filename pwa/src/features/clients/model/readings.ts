import { spotMean, type FilmReadingRow, type JobPanelRow, type JobRow } from '@panelpass/shared';

/**
 * A vehicle's paint film readings over time: for each panel, its mean thickness (the mean of
 * its spots, each spot the mean of its gauge readings — shared `spotMean`) at each visit and
 * phase (before or after the work). The chart draws it; the table beside it holds the same
 * numbers for reading aloud.
 */

export interface ReadingVisit {
  /** `jobId/phase`. */
  key: string;
  jobId: string;
  phase: string;
  /** When the first reading of this visit and phase was taken. */
  atMs: number;
}

export interface PanelSeries {
  panelKey: string;
  label: string;
  /** Mean µm at each visit (null: the panel was not measured then), one decimal. */
  values: (number | null)[];
}

export interface ReadingsHistory {
  visits: ReadingVisit[];
  panels: PanelSeries[];
}

const round1 = (n: number) => Math.round(n * 10) / 10;

export function readingsHistory(
  jobs: readonly Pick<JobRow, 'id'>[],
  panels: readonly Pick<JobPanelRow, 'id' | 'jobId' | 'panelKey' | 'label' | 'position'>[],
  readings: readonly Pick<
    FilmReadingRow,
    'jobId' | 'panelId' | 'phase' | 'readingsUm' | 'takenAt'
  >[],
): ReadingsHistory {
  const jobIds = new Set(jobs.map((j) => j.id));
  const panelById = new Map(panels.map((p) => [p.id, p]));
  const visitMap = new Map<string, ReadingVisit>();
  // panelKey → visit key → spot means
  const spots = new Map<string, Map<string, number[]>>();
  const panelInfo = new Map<string, { label: string; position: number; atMs: number }>();

  for (const r of readings) {
    if (!jobIds.has(r.jobId) || r.readingsUm.length === 0) continue;
    const panel = panelById.get(r.panelId);
    if (!panel) continue;
    const atMs = Date.parse(r.takenAt);
    const key = `${r.jobId}/${r.phase}`;
    const visit = visitMap.get(key);
    if (!visit) visitMap.set(key, { key, jobId: r.jobId, phase: r.phase, atMs });
    else if (atMs < visit.atMs) visit.atMs = atMs;
    const perVisit = spots.get(panel.panelKey) ?? new Map<string, number[]>();
    const list = perVisit.get(key) ?? [];
    list.push(spotMean(r.readingsUm).meanUm);
    perVisit.set(key, list);
    spots.set(panel.panelKey, perVisit);
    // The latest visit's label and place names the panel.
    const known = panelInfo.get(panel.panelKey);
    if (!known || atMs > known.atMs) {
      panelInfo.set(panel.panelKey, { label: panel.label, position: panel.position, atMs });
    }
  }

  const phaseOrder = (p: string) => (p === 'before' ? 0 : p === 'after' ? 1 : 2);
  const visits = [...visitMap.values()].sort(
    (a, b) => a.atMs - b.atMs || phaseOrder(a.phase) - phaseOrder(b.phase),
  );
  const series: PanelSeries[] = [...spots.entries()]
    .map(([panelKey, perVisit]) => ({
      panelKey,
      label: panelInfo.get(panelKey)?.label ?? panelKey,
      values: visits.map((v) => {
        const list = perVisit.get(v.key);
        return list ? round1(list.reduce((s, x) => s + x, 0) / list.length) : null;
      }),
    }))
    .sort(
      (a, b) =>
        (panelInfo.get(a.panelKey)?.position ?? 0) - (panelInfo.get(b.panelKey)?.position ?? 0) ||
        a.label.localeCompare(b.label),
    );
  return { visits, panels: series };
}

/** The chart's text alternative: what it shows, and the thinnest and thickest panels now. */
export function readingsSummary(
  h: ReadingsHistory,
  formatThickness: (um: number) => string,
): string {
  if (!h.visits.length) return 'No paint film readings for this vehicle yet.';
  const latest = h.visits.length - 1;
  const now = h.panels
    .map((p) => ({ label: p.label, um: p.values[latest] }))
    .filter((p): p is { label: string; um: number } => p.um !== null && p.um !== undefined)
    .sort((a, b) => a.um - b.um);
  const visits = `${h.visits.length} ${h.visits.length === 1 ? 'set' : 'sets'} of readings`;
  const base = `Paint film per panel over time: ${h.panels.length} ${h.panels.length === 1 ? 'panel' : 'panels'}, ${visits}.`;
  if (!now.length) return base;
  const thin = now[0]!;
  const thick = now[now.length - 1]!;
  return `${base} Latest: thinnest ${thin.label} at ${formatThickness(thin.um)}, thickest ${thick.label} at ${formatThickness(thick.um)}.`;
}
