// Progress of a job's panel board: counts by state, percent done by panel and by area.
import { InputError } from '../errors';
import { nonEmpty, nonNegative, oneOf } from '../internal/validate';
import { Reason, reason } from '../reasons';
import { bodyStyleTemplate, BodyStyle } from './templates';

export type PanelState = 'todo' | 'in-progress' | 'done' | 'skipped';
export const PANEL_STATES: readonly PanelState[] = ['todo', 'in-progress', 'done', 'skipped'];

export interface BoardPanel {
  readonly id: string;
  readonly state: PanelState;
  readonly areaM2: number;
}

export interface BoardProgress {
  readonly counts: Readonly<Record<PanelState, number>>;
  readonly total: number;
  /** Done ÷ (all − skipped), 0–100; 100 when everything was skipped. */
  readonly percentDone: number;
  /** The same, weighted by panel area. */
  readonly percentDoneByArea: number;
  readonly areaDoneM2: number;
  readonly areaLeftM2: number;
  /** First panel, in board order (top-down), that is in progress, else to do; null when none. */
  readonly nextPanelId: string | null;
  readonly reasons: readonly Reason<'nothing-left' | 'all-skipped'>[];
}

export function boardProgress(panels: readonly BoardPanel[]): BoardProgress {
  const list = nonEmpty('panels', panels);
  const counts: Record<PanelState, number> = { todo: 0, 'in-progress': 0, done: 0, skipped: 0 };
  const ids = new Set<string>();
  let areaDone = 0;
  let areaCounted = 0;
  list.forEach((p, i) => {
    if (typeof p.id !== 'string' || p.id === '')
      throw new InputError(`panels[${i}].id`, 'non-empty', 'Each panel needs an id');
    if (ids.has(p.id))
      throw new InputError(`panels[${i}].id`, 'unique', `Panel ${p.id} is on the board twice`);
    ids.add(p.id);
    const state = oneOf(`panels[${i}].state`, p.state, PANEL_STATES);
    const area = nonNegative(`panels[${i}].areaM2`, p.areaM2);
    counts[state] += 1;
    if (state !== 'skipped') areaCounted += area;
    if (state === 'done') areaDone += area;
  });
  const counted = list.length - counts.skipped;
  const reasons: Reason<'nothing-left' | 'all-skipped'>[] = [];
  if (counted === 0)
    reasons.push(reason('all-skipped', 'info', 'Every panel was skipped: nothing to do.'));
  else if (counts.done === counted)
    reasons.push(reason('nothing-left', 'info', 'Every panel is done.'));
  const next = list.find((p) => p.state === 'in-progress') ?? list.find((p) => p.state === 'todo');
  return {
    counts,
    total: list.length,
    percentDone: counted === 0 ? 100 : (counts.done / counted) * 100,
    percentDoneByArea:
      areaCounted === 0
        ? counted === 0 || counts.done === counted
          ? 100
          : 0
        : (areaDone / areaCounted) * 100,
    areaDoneM2: areaDone,
    areaLeftM2: areaCounted - areaDone,
    nextPanelId: next?.id ?? null,
    reasons,
  };
}

/** A fresh board for a body style: every panel to do, in top-down order. */
export function boardFromTemplate(style: BodyStyle): BoardPanel[] {
  return bodyStyleTemplate(style).map((p) => ({ id: p.id, state: 'todo', areaM2: p.areaM2 }));
}
