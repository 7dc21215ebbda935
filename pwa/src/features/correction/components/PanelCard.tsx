import type { ClearCoatBudgetResult, JobPanelRow } from '@panelpass/shared';
import { StateTag } from '../../prep/kit/StateTag';
import type { StageUnits } from '../../prep/kit/units';
import {
  asPanelState,
  budgetApplies,
  FINISHES,
  HARDNESSES,
  labelOf,
  STATE_WORDS,
  SUBSTRATE_WORDS,
} from '../model/board';
import { BudgetBar } from './BudgetBar';

/**
 * One panel on the board: its label and state, what it is (finish, substrate, hardness), its
 * latest readings and the clear-coat budget bar. The whole card opens the panel's sheet.
 */
export function PanelCard({
  panel,
  budget,
  spots,
  passCount,
  units,
  onOpen,
}: {
  panel: JobPanelRow;
  budget: ClearCoatBudgetResult | null;
  spots: { before: number | null; after: number | null; spots: number };
  passCount: number;
  units: StageUnits;
  onOpen: () => void;
}) {
  const state = STATE_WORDS[asPanelState(panel.state)];
  const readings =
    spots.before === null && spots.after === null
      ? 'No readings'
      : [
          spots.before !== null
            ? `Before ${units.formatThickness(Math.round(spots.before))}`
            : null,
          spots.after !== null ? `after ${units.formatThickness(Math.round(spots.after))}` : null,
        ]
          .filter(Boolean)
          .join(' · ');
  return (
    <button type="button" className={`pp-card pp-card--${state.tone} pp-panel`} onClick={onOpen}>
      <span className="pp-card__head">
        <span className="pp-card__title">{panel.label}</span>
        <StateTag tone={state.tone} words={state.tag} />
      </span>
      <span className="pp-card__meta">
        {labelOf(FINISHES, panel.finish)} · {SUBSTRATE_WORDS[panel.substrate] ?? panel.substrate} ·{' '}
        {panel.hardness && panel.hardness !== 'unknown'
          ? `${labelOf(HARDNESSES, panel.hardness).toLowerCase()} paint`
          : 'hardness not tested'}
      </span>
      <span className="pp-panel__readings">
        <span className="pp-panel__figure">{readings}</span>
        <span className="pp-card__meta">
          {passCount === 0 ? 'no passes' : `${passCount} pass set${passCount === 1 ? '' : 's'}`}
        </span>
      </span>
      {budget && budgetApplies(panel.finish) ? (
        <BudgetBar budget={budget} unit={units.thickness} />
      ) : (
        <span className="pp-card__meta">No clear coat to budget on this finish.</span>
      )}
    </button>
  );
}
