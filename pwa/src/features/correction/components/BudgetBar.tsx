import type { ClearCoatBudgetResult, ThicknessUnit } from '@panelpass/shared';
import { StateTag } from '../../prep/kit/StateTag';
import { budgetBar, budgetState, budgetWords } from '../model/budget';

/**
 * The clear-coat budget as a horizontal bar: the whole bar is the panel's clear coat, the
 * fill what is left of it, the hatched part on the left the reserve that must stay (its edge
 * marked). Spans only, so it may sit inside a button. A proposed pass shows as a striped piece the fill would lose. Its words say the
 * same ("About 28 µm of clear left — reserve is 26 µm"), with the state as a word and icon.
 */
export function BudgetBar({
  budget,
  proposed,
  unit,
  large = false,
}: {
  budget: ClearCoatBudgetResult;
  /** The budget with a pass about to be logged. */
  proposed?: ClearCoatBudgetResult | null;
  unit: ThicknessUnit;
  large?: boolean;
}) {
  const shown = proposed ?? budget;
  const now = budgetBar(budget);
  const after = budgetBar(shown);
  const state = budgetState(shown);
  const words = budgetWords(shown, unit);
  return (
    <span className={`pp-budget${large ? ' pp-budget--large' : ''}`}>
      <span className="pp-budget__head">
        <StateTag tone={state.tone} words={state.tag} />
      </span>
      <span
        className={`pp-budget__bar pp-budget__bar--${state.tone}`}
        role="img"
        aria-label={words}
      >
        <span className="pp-budget__reserve" style={{ width: `${now.reservePct}%` }} />
        <span className="pp-budget__fill" style={{ width: `${after.leftPct}%` }} />
        {proposed ? (
          <span
            className="pp-budget__proposed"
            style={{
              left: `${after.leftPct}%`,
              width: `${Math.max(0, now.leftPct - after.leftPct)}%`,
            }}
          />
        ) : null}
        <span className="pp-budget__mark" style={{ left: `${now.reservePct}%` }} />
      </span>
      <span className="pp-budget__scale" aria-hidden="true">
        <span style={{ width: `${now.reservePct}%` }}>reserve</span>
      </span>
      <span className="pp-budget__words">
        {proposed ? `After this pass: ${words.charAt(0).toLowerCase()}${words.slice(1)}` : words}
      </span>
    </span>
  );
}
