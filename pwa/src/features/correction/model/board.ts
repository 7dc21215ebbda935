/**
 * The panel board in words: the four bands of our own (top to bottom), each panel's state as
 * a word and an icon, the board's progress (shared `boardProgress`) and the pass choices.
 */
import {
  boardProgress,
  PANEL_BANDS,
  PANEL_STATES,
  spotMean,
  type BoardProgress,
  type FilmReadingRow,
  type JobPanelRow,
  type PanelBand,
  type PanelState,
} from '@panelpass/shared';
import type { Option } from '../../prep/kit/fields';
import type { Tone } from '../../prep/kit/StateTag';

export const BAND_WORDS: Record<PanelBand | 'other', { title: string; what: string }> = {
  top: { title: 'Top', what: 'roof and pillars' },
  upper: { title: 'Upper', what: 'hood, trunk lid, mirrors, upper doors' },
  middle: { title: 'Middle', what: 'fenders, doors, sides' },
  lower: { title: 'Lower', what: 'rockers and lower bumpers' },
  other: { title: 'Other', what: 'panels outside the four bands' },
};

/** The job's panels grouped in the four bands, each band in board order (top-down). */
export function panelsByBand(
  panels: readonly JobPanelRow[],
): { band: PanelBand | 'other'; panels: JobPanelRow[] }[] {
  const sorted = [...panels].sort((a, b) => a.position - b.position);
  const groups: { band: PanelBand | 'other'; panels: JobPanelRow[] }[] = PANEL_BANDS.map(
    (band) => ({ band, panels: sorted.filter((p) => p.band === band) }),
  );
  // A band the app does not know (never from our templates): shown last, not lost.
  const other = sorted.filter((p) => !(PANEL_BANDS as readonly string[]).includes(p.band));
  groups.push({ band: 'other', panels: other });
  return groups.filter((g) => g.panels.length > 0);
}

export const STATE_WORDS: Record<PanelState, { tag: string; tone: Tone }> = {
  todo: { tag: 'To do', tone: 'go' },
  'in-progress': { tag: 'Working', tone: 'wait' },
  done: { tag: 'Done', tone: 'done' },
  skipped: { tag: 'Skipped', tone: 'quiet' },
};

export const asPanelState = (state: string): PanelState =>
  (PANEL_STATES as readonly string[]).includes(state) ? (state as PanelState) : 'todo';

/** The board's progress in one line: "3 of 14 panels done · 2 working · 1 skipped". */
export function progressOf(panels: readonly JobPanelRow[]): {
  progress: BoardProgress | null;
  words: string;
} {
  if (panels.length === 0) return { progress: null, words: 'No panels on this job.' };
  const progress = boardProgress(
    panels.map((p) => ({ id: p.id, state: asPanelState(p.state), areaM2: Math.max(0, p.areaM2) })),
  );
  const { counts } = progress;
  const counted = progress.total - counts.skipped;
  const parts = [`${counts.done} of ${counted} panels done`];
  if (counts['in-progress']) parts.push(`${counts['in-progress']} working`);
  if (counts.skipped) parts.push(`${counts.skipped} skipped`);
  return { progress, words: parts.join(' · ') };
}

/** The latest spot of each phase on a panel (µm), for the card. */
export function latestSpots(
  panelId: string,
  readings: readonly FilmReadingRow[],
): { before: number | null; after: number | null; spots: number } {
  const mine = readings
    .filter((r) => r.panelId === panelId && r.readingsUm.length > 0)
    .sort((a, b) => Date.parse(a.takenAt) - Date.parse(b.takenAt));
  const last = (phase: string) => {
    const r = mine.filter((x) => x.phase === phase).at(-1);
    return r ? spotMean(r.readingsUm).meanUm : null;
  };
  return { before: last('before'), after: last('after'), spots: mine.length };
}

export const MACHINES: readonly Option[] = [
  { value: 'dual-action', label: 'Dual action' },
  { value: 'rotary', label: 'Rotary' },
  { value: 'forced-rotation', label: 'Forced rotation' },
  { value: 'hand', label: 'By hand' },
  { value: 'other', label: 'Other' },
];

export const RESULTS: readonly Option[] = [
  { value: 'another-pass', label: 'Another pass' },
  { value: 'change-combination', label: 'Change combination' },
  { value: 'done', label: 'Done' },
];

export const FINISHES: readonly Option[] = [
  { value: 'clear-coat', label: 'Clear-coated paint' },
  { value: 'single-stage', label: 'Single-stage paint' },
  { value: 'gloss-black-trim', label: 'Gloss-black trim (very soft)' },
  { value: 'vinyl', label: 'Vinyl' },
  { value: 'chrome', label: 'Chrome' },
  { value: 'textured-plastic', label: 'Textured plastic' },
];

export const HARDNESSES: readonly Option[] = [
  { value: 'soft', label: 'Soft' },
  { value: 'medium', label: 'Medium' },
  { value: 'hard', label: 'Hard' },
  { value: 'unknown', label: 'Not known' },
];

export const SUBSTRATE_WORDS: Record<string, string> = {
  steel: 'steel',
  aluminium: 'aluminium',
  plastic: 'plastic',
  composite: 'composite',
  unknown: 'substrate not known',
};

/** Finishes with no clear coat to budget: nothing to cut through with a machine pass. */
const NO_CLEAR = ['chrome', 'vinyl', 'textured-plastic'];

/** Whether the clear-coat budget means anything for a panel of this finish. */
export function budgetApplies(finish: string): boolean {
  return !NO_CLEAR.includes(finish);
}

export const labelOf = (options: readonly Option[], value: string | null) =>
  options.find((o) => o.value === value)?.label ?? value ?? '';

/** The pass step that usually goes with a product's kind on the Shelf. */
export function stepForProductKind(kind: string): string | null {
  if (kind === 'compound') return 'heavy-compound';
  if (kind === 'polish') return 'polish';
  if (kind === 'finishing-polish') return 'finishing';
  return null;
}
