import { IonBackButton, IonPage } from '@ionic/react';
import { IonButtons, IonContent, IonHeader, IonToolbar } from '../../components/ionic';
import { Suspense, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import type { JobRow } from '@panelpass/shared';
import { useJobRows, useRow } from '../../db/hooks';
import { EmptyState } from '../../components/EmptyState';
import { SyncBadge } from '../shell/components/SyncBadge';
import { JobSummary } from './components/JobSummary';
import { StageActions } from './components/StageActions';
import { StageBar } from './components/StageBar';
import { customerName, vehicleDetails, vehicleLabel, windowWords } from './model/jobWords';
import { stageOf, stageSteps, viewLabel, type WorkspaceView } from './model/stages';
import { ChipsScreen, stageScreens } from './stageScreens';
import './workspace.css';

/**
 * One job, one stage at a time: who and where at the top, the stage bar, the stage's work,
 * and the stage's main action at the bottom. Opened at /jobs/:id (deep links and reloads
 * work: everything is read from the phone's database).
 */
export default function JobWorkspacePage() {
  const { id } = useParams<{ id: string }>();
  const job = useRow('jobs', id);
  const customer = useRow('customers', job?.customerId);
  const vehicle = useRow('vehicles', job?.vehicleId);
  const signatures = useJobRows('signatures', job?.id);
  // The step picked in the bar, for the stage the job was at when it was picked: after a
  // move the workspace follows the job to its new stage.
  const [picked, setPicked] = useState<{ view: WorkspaceView; at: string } | null>(null);

  const stage = stageOf(job?.stage ?? 'booked');
  const viewing: WorkspaceView = picked && picked.at === job?.stage ? picked.view : stage;
  const title = job ? customerName(customer) : 'Job';

  const signedCondition = signatures?.some((s) => s.kind === 'condition') ?? false;
  const warnBeforeForward =
    stage === 'walkaround' && signatures !== undefined && !signedCondition
      ? 'The owner has not signed the condition record yet. Without it, damage found later is your word against theirs.'
      : null;

  return (
    <IonPage>
      <IonHeader>
        <IonToolbar>
          <IonButtons slot="start">
            <IonBackButton
              defaultHref="/jobs"
              text=""
              aria-label="Back to the jobs"
              className="pp-ws-back"
            />
          </IonButtons>
          <div className="pp-header pp-ws-header">
            <h1 className="pp-header__title">{title}</h1>
            <div className="pp-header__tools">
              <SyncBadge />
            </div>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        {job ? (
          <div className="pp-ws-stagebar">
            <StageBar
              steps={stageSteps(stage)}
              viewing={viewing}
              onView={(view) => setPicked({ view, at: job.stage })}
            />
          </div>
        ) : null}
        <div className="pp-page pp-ws">
          {job === undefined ? (
            <div className="pp-loading" aria-busy="true" />
          ) : job === null ? (
            <EmptyState title="This job is not on this phone">
              <p>
                It may have been removed, or it is not one of your jobs.{' '}
                <Link className="pp-link" to="/jobs">
                  Back to the jobs
                </Link>
              </p>
            </EmptyState>
          ) : (
            <>
              <section className="pp-ws-job" aria-label="The job">
                <p className="pp-ws-job__vehicle">{vehicleLabel(vehicle)}</p>
                {vehicle ? <p className="pp-ws-job__line">{vehicleDetails(vehicle)}</p> : null}
                <p className="pp-ws-job__line">{windowWords(job)}</p>
                {job.address ? <p className="pp-ws-job__line">{job.address}</p> : null}
              </section>
              {viewing !== stage && !besideTheStage(viewing, stage) ? (
                <div className="pp-ws-elsewhere" role="status">
                  <p>
                    Showing {viewLabel(viewing)}. The job is at {viewLabel(stage)}.
                  </p>
                  <button
                    type="button"
                    className="pp-button pp-button--quiet-go"
                    onClick={() => setPicked(null)}
                  >
                    Show {viewLabel(stage)}
                  </button>
                </div>
              ) : null}
              <StageScreen view={viewing} jobId={job.id} job={job} />
            </>
          )}
        </div>
      </IonContent>
      {job ? (
        <StageActions jobId={job.id} stage={stage} warnBeforeForward={warnBeforeForward} />
      ) : null}
    </IonPage>
  );
}

/** Chips are worked on during prep and correction: looking at them is not looking away. */
function besideTheStage(view: WorkspaceView, stage: string): boolean {
  return view === 'chips' && (stage === 'prep' || stage === 'correction');
}

function StageScreen({ view, jobId, job }: { view: WorkspaceView; jobId: string; job: JobRow }) {
  if (view === 'booked' || view === 'closed') return <JobSummary job={job} />;
  const Screen = view === 'chips' ? ChipsScreen : stageScreens[view];
  if (!Screen) return <JobSummary job={job} />;
  return (
    <Suspense fallback={<div className="pp-loading pp-ws-loading" aria-busy="true" />}>
      <Screen jobId={jobId} />
    </Suspense>
  );
}
