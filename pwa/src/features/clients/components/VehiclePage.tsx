import { lazy, Suspense, useMemo, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { isJobStage, type SignatureRow } from '@panelpass/shared';
import { EmptyState } from '../../../components/EmptyState';
import { useSession } from '../../auth/hooks/useSession';
import { StageTag } from '../../jobs/components/StageTag';
import { PhotoStrip } from '../../photos';
import { useUnits } from '../../settings/useUnits';
import { useMoney } from '../../shelf/hooks/useMoney';
import { useVehicleFile, type VehicleFile } from '../hooks/useClients';
import { vehicleName } from '../model/clients';
import { readingsHistory, readingsSummary } from '../model/readings';
import { OfficePage } from './OfficePage';
import { ReadingsTable } from './ReadingsTable';
import { BODY_STYLE_WORDS, VehicleSheet } from './VehicleSheet';
import '../../prep/kit/stageKit.css';
import '../../shelf/shelf.css';

// The chart brings uPlot: loaded only when a vehicle's history is opened.
const ReadingsChart = lazy(() =>
  import('./ReadingsChart').then((m) => ({ default: m.ReadingsChart })),
);

const SIGNATURE_WORDS: Record<string, string> = {
  condition: 'Condition record',
  acceptance: 'Work accepted',
  quote: 'Quote accepted',
};

const dateWords = (iso: string) =>
  new Date(iso).toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
const dateTimeWords = (iso: string) =>
  new Date(iso).toLocaleString(undefined, {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });

/**
 * One vehicle's history: its details, every visit (date, stage, price), the paint film per
 * panel over time (a chart and the same numbers in a table), its photos (from the phone's
 * own copies where it has them) and the signatures on its visits.
 */
export default function VehiclePage() {
  const { vehicleId } = useParams<{ vehicleId: string }>();
  const file = useVehicleFile(vehicleId);
  const vehicle = file?.vehicle ?? null;
  return (
    <OfficePage
      title={vehicle ? vehicleName(vehicle) : 'Vehicle'}
      backTo={vehicle ? `/clients/${vehicle.customerId}` : '/clients'}
      backWords="Back to the customer"
    >
      {file === undefined ? (
        <div className="pp-loading" aria-busy="true" />
      ) : vehicle === null ? (
        <EmptyState title="This vehicle is not on this phone">
          <p>
            <Link className="pp-link" to="/clients">
              Back to the clients
            </Link>
          </p>
        </EmptyState>
      ) : (
        <VehicleHistory file={file} />
      )}
    </OfficePage>
  );
}

function VehicleHistory({ file }: { file: VehicleFile }) {
  const vehicle = file.vehicle!;
  const isOwner = useSession()?.user.role === 'owner';
  const units = useUnits();
  const money = useMoney();
  const [editing, setEditing] = useState(false);
  const history = useMemo(
    () => readingsHistory(file.jobs, file.panels, file.readings),
    [file.jobs, file.panels, file.readings],
  );
  const summary = readingsSummary(history, units.formatThickness);

  return (
    <div className="pp-office">
      <section className="pp-office-section" aria-labelledby="pp-vehicle-facts">
        <h2 id="pp-vehicle-facts" className="pp-office-section__title">
          The vehicle
        </h2>
        <dl className="pp-office-facts">
          <dt>Plate</dt>
          <dd>{vehicle.plate ?? 'Not given'}</dd>
          <dt>Owner</dt>
          <dd>
            {file.customer ? (
              <Link className="pp-link" to={`/clients/${file.customer.id}`}>
                {file.customer.name}
              </Link>
            ) : (
              'Not on this phone'
            )}
          </dd>
          <dt>Body style</dt>
          <dd>{BODY_STYLE_WORDS[vehicle.bodyStyle] ?? vehicle.bodyStyle}</dd>
          {vehicle.paintNotes ? (
            <>
              <dt>Paint notes</dt>
              <dd>{vehicle.paintNotes}</dd>
            </>
          ) : null}
        </dl>
        {isOwner ? (
          <button
            type="button"
            className="pp-button pp-button--quiet"
            onClick={() => setEditing(true)}
          >
            Change the vehicle
          </button>
        ) : null}
      </section>

      <section className="pp-office-section" aria-labelledby="pp-vehicle-jobs">
        <h2 id="pp-vehicle-jobs" className="pp-office-section__title">
          Visits
        </h2>
        {file.jobs.length ? (
          <ul className="pp-office-list" aria-label="Visits of this vehicle">
            {file.jobs.map((j) => (
              <li key={j.id}>
                <Link className="pp-office-row" to={`/jobs/${j.id}`}>
                  <span className="pp-office-row__top">
                    <span className="pp-office-row__name">{dateWords(j.windowStart)}</span>
                    {isJobStage(j.stage) ? <StageTag stage={j.stage} /> : j.stage}
                  </span>
                  <span className="pp-office-row__meta">
                    {j.services.length ? j.services.join(', ') : 'No work listed'}
                  </span>
                  {j.priceMinor !== undefined ? (
                    <span className="pp-office-row__figure">{money.amount(j.priceMinor)}</span>
                  ) : null}
                </Link>
              </li>
            ))}
          </ul>
        ) : (
          <p className="pp-stage-muted">No visits yet.</p>
        )}
      </section>

      <section className="pp-office-section" aria-labelledby="pp-vehicle-readings">
        <h2 id="pp-vehicle-readings" className="pp-office-section__title">
          Paint film over time
        </h2>
        {history.visits.length ? (
          <>
            <Suspense fallback={<div className="pp-office-chart" aria-busy="true" />}>
              <ReadingsChart
                history={history}
                summary={summary}
                fromUm={units.fromUm}
                unitSymbol={units.thicknessSymbol}
              />
            </Suspense>
            <ReadingsTable
              history={history}
              formatThickness={units.formatThickness}
              unitSymbol={units.thicknessSymbol}
            />
          </>
        ) : (
          <p className="pp-stage-muted">{summary}</p>
        )}
      </section>

      <section className="pp-office-section" aria-labelledby="pp-vehicle-photos">
        <h2 id="pp-vehicle-photos" className="pp-office-section__title">
          Photos
        </h2>
        <PhotoStrip
          photos={file.photos}
          label="Photos of this vehicle"
          empty="No photos of this vehicle yet."
        />
      </section>

      <section className="pp-office-section" aria-labelledby="pp-vehicle-signatures">
        <h2 id="pp-vehicle-signatures" className="pp-office-section__title">
          Signatures
        </h2>
        {file.signatures.length ? (
          <ul className="pp-office-list" aria-label="Signatures">
            {file.signatures.map((s) => (
              <li key={s.id}>
                <SignatureItem signature={s} />
              </li>
            ))}
          </ul>
        ) : (
          <p className="pp-stage-muted">No signatures on this vehicle’s visits yet.</p>
        )}
      </section>

      {isOwner ? (
        <VehicleSheet
          isOpen={editing}
          onClose={() => setEditing(false)}
          customerId={vehicle.customerId}
          vehicle={vehicle}
        />
      ) : null}
    </div>
  );
}

/** A signature: what was signed, by whom and when, and the fingerprint of what was signed. */
function SignatureItem({ signature: s }: { signature: SignatureRow }) {
  return (
    <div className="pp-card pp-card--done">
      <p className="pp-card__title">{SIGNATURE_WORDS[s.kind] ?? s.kind}</p>
      <p className="pp-stage-muted">
        Signed by {s.signerName} on {dateTimeWords(s.signedAt)}
      </p>
      <p className="pp-office-hash">
        <span>Record fingerprint (SHA-256): </span>
        <code>{s.recordHash}</code>
      </p>
    </div>
  );
}
