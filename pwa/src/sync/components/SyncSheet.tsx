import { IonModal, useIonAlert } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../components/ionic';
import { useState } from 'react';
import type { RejectedMutation } from '@panelpass/shared';
import { Notice, type NoticeTone } from '../../components/Notice';
import { commandWords } from '../commandWords';
import { useSync, type SyncStatusView } from '../context';
import { useSyncStatus } from '../useSyncStatus';
import './sync.css';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/** The state in one sentence, with its tone (never colour alone: the Notice adds an icon). */
export function syncSummary(s: SyncStatusView): { tone: NoticeTone; words: string } {
  const images = s.waitingImages
    ? `, with ${plural(s.waitingImages, 'photo or signature', 'photos or signatures')}`
    : '';
  if (s.pending > 0 && !s.online) {
    return {
      tone: 'wait',
      words: `No signal: ${plural(s.pending, 'change waits', 'changes wait')} on this phone${images}. They go as soon as there is a signal.`,
    };
  }
  if (s.pending > 0) {
    const why = s.lastError ? ` ${s.lastError}` : '';
    return {
      tone: 'wait',
      words: `${plural(s.pending, 'change', 'changes')} waiting to send${images}.${why}`,
    };
  }
  return { tone: 'done', words: 'Everything done on this phone is saved on the server.' };
}

/** "Last saved to the server at 14:02" (or with the day when it was not today). */
export function lastSavedWords(lastSyncAt: number | null, now = Date.now()): string {
  if (lastSyncAt === null) return 'Not saved to the server from this phone yet.';
  const at = new Date(lastSyncAt);
  const time = at.toLocaleTimeString(undefined, { timeStyle: 'short' });
  const sameDay = at.toDateString() === new Date(now).toDateString();
  if (sameDay) return `Last saved to the server at ${time}.`;
  const day = at.toLocaleDateString(undefined, { day: 'numeric', month: 'short' });
  return `Last saved to the server on ${day} at ${time}.`;
}

function madeAt(iso: string): string {
  const at = new Date(iso);
  return Number.isNaN(at.getTime()) ? '' : at.toLocaleTimeString(undefined, { timeStyle: 'short' });
}

/**
 * What waits on the phone, when it last reached the server, and each change the server
 * refused with its reason: try it again (after fixing what the reason says) or discard it.
 */
export function SyncSheet({ isOpen, onClose }: { isOpen: boolean; onClose: () => void }) {
  const sync = useSync();
  const status = useSyncStatus();
  const [presentAlert] = useIonAlert();
  const [busy, setBusy] = useState<number | 'send' | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const summary = syncSummary(status);

  async function run(which: number | 'send', work: () => Promise<unknown>) {
    setBusy(which);
    setProblem(null);
    try {
      await work();
    } catch (error) {
      setProblem(error instanceof Error ? error.message : 'That did not work; try again.');
    } finally {
      setBusy(null);
    }
  }

  function confirmDiscard(r: RejectedMutation) {
    void presentAlert({
      cssClass: 'pp-confirm',
      header: 'Discard this change?',
      message: `“${commandWords(r.name)}” stays off the server and off this phone.`,
      buttons: [
        { text: 'Keep it', role: 'cancel' },
        {
          text: 'Discard',
          role: 'destructive',
          cssClass: 'pp-alert-stop',
          handler: () => void run(r.id, () => sync?.discardRejected(r.id) ?? Promise.resolve()),
        },
      ],
    });
  }

  return (
    <IonModal isOpen={isOpen} onDidDismiss={onClose} aria-label="Saving to the server">
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 id="pp-sync-title" className="pp-header__title">
              Saving to the server
            </h2>
            <IonButton className="pp-signout" fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page">
          <Notice tone={summary.tone}>{summary.words}</Notice>
          <p className="pp-sync-sheet__when">{lastSavedWords(status.lastSyncAt)}</p>
          {problem && <Notice tone="stop">{problem}</Notice>}
          {status.rejected.length > 0 && (
            <section aria-labelledby="pp-rejected-title">
              <h3 id="pp-rejected-title" className="pp-sync-sheet__heading">
                {plural(status.rejected.length, 'change needs', 'changes need')} a look
              </h3>
              <p className="pp-sync-sheet__when">
                The server did not take these. Fix what it says, then try again — or discard.
              </p>
              <ul className="pp-rejected">
                {status.rejected.map((r) => (
                  <li key={r.id} className="pp-rejected__item">
                    <p className="pp-rejected__what">
                      {commandWords(r.name)}
                      {madeAt(r.createdAt) && `, made at ${madeAt(r.createdAt)}`}
                    </p>
                    <p className="pp-rejected__why">{r.message}</p>
                    <div className="pp-rejected__actions">
                      <button
                        type="button"
                        className="pp-button"
                        disabled={busy !== null}
                        onClick={() =>
                          void run(r.id, () => sync?.retryRejected(r.id) ?? Promise.resolve())
                        }
                      >
                        {busy === r.id ? 'Trying…' : 'Try again'}
                      </button>
                      <button
                        type="button"
                        className="pp-button pp-button--quiet"
                        disabled={busy !== null}
                        onClick={() => confirmDiscard(r)}
                      >
                        Discard
                      </button>
                    </div>
                  </li>
                ))}
              </ul>
            </section>
          )}
          <div className="pp-actions">
            <button
              type="button"
              className="pp-button"
              disabled={!sync || busy !== null || status.syncing}
              onClick={() => void run('send', () => sync?.syncNow() ?? Promise.resolve())}
            >
              {status.syncing || busy === 'send' ? 'Sending…' : 'Send now'}
            </button>
          </div>
        </div>
      </IonContent>
    </IonModal>
  );
}
