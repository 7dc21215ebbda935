import { chevronForwardOutline } from 'ionicons/icons';
import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { isJobStage, STAGE_LABELS } from '@panelpass/shared';
import { EmptyState } from '../../../components/EmptyState';
import { Notice } from '../../../components/Notice';
import { useSession } from '../../auth/hooks/useSession';
import { useCustomerFile, type CustomerFile } from '../hooks/useClients';
import { vehicleName } from '../model/clients';
import { CustomerSheet } from './CustomerSheet';
import { OfficePage } from './OfficePage';
import { VehicleSheet } from './VehicleSheet';
import '../../prep/kit/stageKit.css';
import '../../shelf/shelf.css';
import { Icon } from '../../../components/Icon';

const visitWords = (n: number) => `${n} ${n === 1 ? 'visit' : 'visits'}`;

/** One customer: how to reach them, their vehicles (each opens its history) and visits. */
export default function CustomerPage() {
  const { customerId } = useParams<{ customerId: string }>();
  const file = useCustomerFile(customerId);
  return (
    <OfficePage
      title={file?.customer?.name ?? 'Customer'}
      backTo="/clients"
      backWords="Back to the clients"
    >
      {file === undefined ? (
        <div className="pp-loading" aria-busy="true" />
      ) : file.customer === null ? (
        <EmptyState title="This customer is not on this phone">
          <p>
            <Link className="pp-link" to="/clients">
              Back to the clients
            </Link>
          </p>
        </EmptyState>
      ) : (
        <CustomerDetail
          file={file as CustomerFile & { customer: NonNullable<CustomerFile['customer']> }}
        />
      )}
    </OfficePage>
  );
}

function CustomerDetail({
  file,
}: {
  file: CustomerFile & { customer: NonNullable<CustomerFile['customer']> };
}) {
  const { customer, vehicles, jobs } = file;
  const isOwner = useSession()?.user.role === 'owner';
  const [editing, setEditing] = useState(false);
  const [addingVehicle, setAddingVehicle] = useState(false);
  const sortedJobs = [...jobs].sort((a, b) => b.windowStart.localeCompare(a.windowStart));
  const vehicleOf = new Map(vehicles.map((v) => [v.id, v]));

  return (
    <div className="pp-office">
      <section className="pp-office-section" aria-labelledby="pp-customer-contact">
        <h2 id="pp-customer-contact" className="pp-office-section__title">
          Contact
        </h2>
        <dl className="pp-office-facts">
          <dt>Phone</dt>
          <dd>
            {customer.phone ? (
              <a className="pp-link" href={`tel:${customer.phone.replace(/[^\d+]/g, '')}`}>
                {customer.phone}
              </a>
            ) : (
              'Not given'
            )}
          </dd>
          <dt>E-mail</dt>
          <dd>
            {customer.email ? (
              <a className="pp-link" href={`mailto:${customer.email}`}>
                {customer.email}
              </a>
            ) : (
              'Not given'
            )}
          </dd>
          <dt>Address</dt>
          <dd>{customer.address || 'Not given'}</dd>
          {customer.notes ? (
            <>
              <dt>Notes</dt>
              <dd>{customer.notes}</dd>
            </>
          ) : null}
        </dl>
        {customer.version === 0 ? (
          <Notice tone="info">
            Added on this phone: it goes to the server with the next sync.
          </Notice>
        ) : null}
        {isOwner ? (
          <button
            type="button"
            className="pp-button pp-button--quiet"
            onClick={() => setEditing(true)}
          >
            Change the details
          </button>
        ) : null}
      </section>

      <section className="pp-office-section" aria-labelledby="pp-customer-vehicles">
        <h2 id="pp-customer-vehicles" className="pp-office-section__title">
          Vehicles
        </h2>
        {vehicles.length ? (
          <ul className="pp-office-list" aria-label="Vehicles">
            {vehicles.map((v) => (
              <li key={v.id}>
                <Link className="pp-office-row" to={`/clients/vehicles/${v.id}`}>
                  <span className="pp-office-row__name">{vehicleName(v)}</span>
                  <span className="pp-office-row__meta">
                    {[v.plate, visitWords(jobs.filter((j) => j.vehicleId === v.id).length)]
                      .filter(Boolean)
                      .join(' · ')}
                  </span>
                  <Icon className="pp-office-row__go" icon={chevronForwardOutline} />
                </Link>
              </li>
            ))}
          </ul>
        ) : (
          <p className="pp-stage-muted">No vehicle yet.</p>
        )}
        {isOwner ? (
          <button type="button" className="pp-button" onClick={() => setAddingVehicle(true)}>
            Add a vehicle
          </button>
        ) : null}
      </section>

      <section className="pp-office-section" aria-labelledby="pp-customer-visits">
        <h2 id="pp-customer-visits" className="pp-office-section__title">
          Visits
        </h2>
        {sortedJobs.length ? (
          <ul className="pp-office-list" aria-label="Visits">
            {sortedJobs.map((j) => {
              const v = vehicleOf.get(j.vehicleId);
              return (
                <li key={j.id}>
                  <Link className="pp-office-row" to={`/jobs/${j.id}`}>
                    <span className="pp-office-row__name">
                      {new Date(j.windowStart).toLocaleDateString(undefined, {
                        weekday: 'short',
                        day: 'numeric',
                        month: 'short',
                        year: 'numeric',
                      })}
                    </span>
                    <span className="pp-office-row__meta">
                      {isJobStage(j.stage) ? STAGE_LABELS[j.stage] : j.stage}
                      {v ? ` · ${vehicleName(v)}` : ''}
                    </span>
                    <Icon className="pp-office-row__go" icon={chevronForwardOutline} />
                  </Link>
                </li>
              );
            })}
          </ul>
        ) : (
          <p className="pp-stage-muted">No visits yet.</p>
        )}
      </section>

      {isOwner ? (
        <>
          <CustomerSheet isOpen={editing} onClose={() => setEditing(false)} customer={customer} />
          <VehicleSheet
            isOpen={addingVehicle}
            onClose={() => setAddingVehicle(false)}
            customerId={customer.id}
            vehicle={null}
          />
        </>
      ) : null}
    </div>
  );
}
