import { chevronForwardOutline, searchOutline } from 'ionicons/icons';
import { useDeferredValue, useId, useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { EmptyState } from '../../../components/EmptyState';
import { useSession } from '../../auth/hooks/useSession';
import { useClients } from '../hooks/useClients';
import { searchClients, vehicleName, type ClientEntry } from '../model/clients';
import { CustomerSheet } from './CustomerSheet';
import '../../prep/kit/stageKit.css';
import '../../shelf/shelf.css';
import { Icon } from '../../../components/Icon';

/**
 * Clients: every customer on this phone with their vehicles, found by name, phone, e-mail
 * or plate. A row opens the customer; the owner adds customers here (offline too).
 */
export default function ClientsScreen() {
  const data = useClients();
  const isOwner = useSession()?.user.role === 'owner';
  const [query, setQuery] = useState('');
  const deferred = useDeferredValue(query);
  const [adding, setAdding] = useState(false);
  const searchId = useId();
  const found = useMemo(
    () => (data ? searchClients(data.customers, data.vehicles, deferred) : []),
    [data, deferred],
  );

  if (data === undefined) return <div className="pp-loading" aria-busy="true" />;
  const total = data.customers.length;

  return (
    <div className="pp-office">
      {total === 0 ? (
        <EmptyState title="No clients yet">
          <p>
            {isOwner
              ? 'Each customer, their cars and every visit are kept here. Add the first one below.'
              : 'The customers of the jobs given to you show up here.'}
          </p>
        </EmptyState>
      ) : (
        <>
          <div className="pp-field pp-office-search">
            <label className="pp-field__label" htmlFor={searchId}>
              Search clients
            </label>
            <div className="pp-field__control">
              <Icon className="pp-office-search__icon" icon={searchOutline} />
              <input
                id={searchId}
                className="pp-field__input"
                type="search"
                enterKeyHint="search"
                autoComplete="off"
                placeholder="Name, phone, e-mail or plate"
                value={query}
                onChange={(e) => setQuery(e.target.value)}
              />
            </div>
          </div>
          <p className="pp-office-count" role="status">
            {found.length === total
              ? `${total} ${total === 1 ? 'client' : 'clients'}`
              : `${found.length} of ${total} clients`}
            {deferred.trim() ? ` matching “${deferred.trim()}”` : ''}
          </p>
        </>
      )}
      {isOwner ? (
        <button type="button" className="pp-button" onClick={() => setAdding(true)}>
          Add a customer
        </button>
      ) : null}
      {found.length ? (
        <ul className="pp-office-list" aria-label="Clients">
          {found.map((entry) => (
            <li key={entry.customer.id}>
              <ClientLink entry={entry} />
            </li>
          ))}
        </ul>
      ) : total > 0 ? (
        <EmptyState title="No client matches">
          <p>Try part of the name, the last digits of the phone, or the plate.</p>
        </EmptyState>
      ) : null}
      {isOwner ? (
        <CustomerSheet isOpen={adding} onClose={() => setAdding(false)} customer={null} />
      ) : null}
    </div>
  );
}

function ClientLink({ entry }: { entry: ClientEntry }) {
  const { customer, vehicles, plateMatches } = entry;
  const shown = [
    ...vehicles.filter((v) => plateMatches.includes(v.id)),
    ...vehicles.filter((v) => !plateMatches.includes(v.id)),
  ];
  return (
    <Link className="pp-office-row" to={`/clients/${customer.id}`}>
      <span className="pp-office-row__name">{customer.name}</span>
      {customer.phone || customer.email ? (
        <span className="pp-office-row__meta">
          {[customer.phone, customer.email].filter(Boolean).join(' · ')}
        </span>
      ) : null}
      {shown.map((v) => (
        <span key={v.id} className="pp-office-row__figure">
          {vehicleName(v)}
          {v.plate ? ` · ${v.plate}` : ''}
        </span>
      ))}
      <Icon className="pp-office-row__go" icon={chevronForwardOutline} />
    </Link>
  );
}
