import { useIonAlert, useIonToast } from '@ionic/react';
import { IonFooter, IonToolbar } from '../../../components/ionic';
import { useState } from 'react';
import { STAGE_LABELS, type JobStage } from '@panelpass/shared';
import { useChanges } from '../../../sync/useChanges';
import { forwardWords, stageMoves } from '../model/stages';

/** The footer's id: toasts of the workspace sit just above it (never over the main action). */
export const FOOTER_ID = 'pp-ws-actions';

/**
 * The stage's main action at the bottom, in thumb reach: "Move to <next stage>" (56 px, full
 * width) and a quieter "Back to <previous>", as the shared stage table allows. A move can be
 * undone from the toast for six seconds; closing the job asks first (it cannot be undone).
 * A move the rules refuse is told in words by useChanges.
 */
export function StageActions({
  jobId,
  stage,
  warnBeforeForward,
}: {
  jobId: string;
  stage: JobStage;
  /** Something to confirm before moving on (e.g. no condition signature yet), or null. */
  warnBeforeForward?: string | null;
}) {
  const recorder = useChanges();
  const [presentAlert] = useIonAlert();
  const [presentToast] = useIonToast();
  const [busy, setBusy] = useState(false);
  const { forward, back } = stageMoves(stage);

  async function move(to: JobStage, from: JobStage, undoable: boolean) {
    setBusy(true);
    try {
      const stored = await recorder.changes.moveJobStage({ id: jobId, stage: to });
      if (!stored) return;
      void presentToast({
        message: `Moved to ${STAGE_LABELS[to]}.`,
        duration: 6000,
        position: 'bottom',
        positionAnchor: FOOTER_ID,
        cssClass: 'pp-toast',
        buttons: undoable
          ? [
              {
                text: 'Undo',
                handler: () => {
                  void recorder.changes.moveJobStage({ id: jobId, stage: from });
                },
              },
            ]
          : [],
      });
    } finally {
      setBusy(false);
    }
  }

  function confirm(header: string, message: string, yes: string, then: () => void) {
    void presentAlert({
      cssClass: 'pp-confirm',
      header,
      message,
      buttons: [
        { text: 'Not yet', role: 'cancel' },
        { text: yes, handler: then },
      ],
    });
  }

  function goForward() {
    if (!forward) return;
    if (forward === 'closed') {
      confirm(
        'Close this job?',
        'A closed job takes no more changes: readings, photos and notes stay as they are.',
        'Close the job',
        () => void move('closed', stage, false),
      );
      return;
    }
    if (warnBeforeForward) {
      confirm(
        `Move to ${STAGE_LABELS[forward]}?`,
        warnBeforeForward,
        `Move to ${STAGE_LABELS[forward]}`,
        () => void move(forward, stage, true),
      );
      return;
    }
    void move(forward, stage, true);
  }

  if (!forward && !back) return null;
  return (
    <IonFooter id={FOOTER_ID} className="pp-ws-actions">
      <IonToolbar>
        <div className="pp-ws-actions__row">
          {back ? (
            <button
              type="button"
              className="pp-button pp-button--back"
              disabled={busy}
              onClick={() => void move(back, stage, true)}
            >
              <span>Back to</span>{' '}
              <span className="pp-ws-actions__back-to">{STAGE_LABELS[back]}</span>
            </button>
          ) : null}
          {forward ? (
            <button
              type="button"
              className="pp-button pp-ws-actions__main"
              disabled={busy}
              onClick={goForward}
            >
              {forwardWords(forward)}
            </button>
          ) : null}
        </div>
      </IonToolbar>
    </IonFooter>
  );
}
