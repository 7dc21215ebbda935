import { useEffect, useRef } from 'react';
import type { StageStep, StepState, WorkspaceView } from '../model/stages';

/** A small mark per state, drawn by us: a tick, a filled dot, an empty ring, a dashed ring. */
function StepMark({ state }: { state: StepState }) {
  return (
    <svg className="pp-ws-step__mark" width="22" height="22" viewBox="0 0 24 24" aria-hidden="true">
      {state === 'done' ? (
        <>
          <circle cx="12" cy="12" r="10" className="pp-ws-step__mark-fill" />
          <path d="M7 12.5l3.2 3.2L17 9" className="pp-ws-step__mark-tick" />
        </>
      ) : state === 'current' ? (
        <>
          <circle cx="12" cy="12" r="10" className="pp-ws-step__mark-ring" />
          <circle cx="12" cy="12" r="5.5" className="pp-ws-step__mark-fill" />
        </>
      ) : state === 'beside' ? (
        <circle
          cx="12"
          cy="12"
          r="10"
          className="pp-ws-step__mark-ring pp-ws-step__mark-ring--dashed"
        />
      ) : (
        <circle cx="12" cy="12" r="10" className="pp-ws-step__mark-ring" />
      )}
    </svg>
  );
}

/**
 * The job's stages across the top, one labelled step each, scrolling sideways: done (tick),
 * now (dot), later (ring), and Chips beside the line. Tapping a step shows that stage's
 * screen; the job's stage itself only changes with the button at the bottom.
 */
export function StageBar({
  steps,
  viewing,
  onView,
}: {
  steps: readonly StageStep[];
  viewing: WorkspaceView;
  onView: (view: WorkspaceView) => void;
}) {
  const list = useRef<HTMLOListElement>(null);
  useEffect(() => {
    const shown = list.current?.querySelector<HTMLElement>('[aria-pressed="true"]');
    shown?.scrollIntoView?.({ block: 'nearest', inline: 'center' });
  }, [viewing]);
  return (
    <nav className="pp-ws-stages" aria-label="Stages of this job">
      <ol ref={list} className="pp-ws-steps">
        {steps.map((step) => (
          <li key={step.view} className={`pp-ws-step pp-ws-step--${step.state}`}>
            <button
              type="button"
              className="pp-ws-step__button"
              aria-pressed={step.view === viewing}
              aria-current={step.state === 'current' ? 'step' : undefined}
              onClick={() => onView(step.view)}
            >
              <StepMark state={step.state} />
              <span className="pp-ws-step__label">{step.label}</span>
              <span className="pp-ws-step__state">{step.stateWord}</span>
            </button>
          </li>
        ))}
      </ol>
    </nav>
  );
}
