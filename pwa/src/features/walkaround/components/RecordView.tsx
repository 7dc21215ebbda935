import type { ConditionRecord } from '../model/conditionRecord';
import { useImageUrl } from '../../photos';

function RecordPhoto({ sha256, label }: { sha256: string; label: string }) {
  const url = useImageUrl(sha256);
  if (!url) return <span className="pp-record__photo pp-record__photo--missing">{label}</span>;
  return <img className="pp-record__photo" src={url} alt={label} />;
}

/**
 * The condition record as the owner reads it before signing. Drawn from the record object
 * alone, so what is shown is exactly what is signed and hashed.
 */
export function RecordView({ record }: { record: ConditionRecord }) {
  return (
    <article className="pp-record" aria-label="Condition record">
      <h3 className="pp-record__title">
        {record.vehicle}
        {record.vehicleDetails ? (
          <span className="pp-record__sub">{record.vehicleDetails}</span>
        ) : null}
      </h3>
      {record.address ? <p className="pp-record__line">{record.address}</p> : null}

      <h4 className="pp-record__heading">Condition notes</h4>
      <p className="pp-record__notes">{record.conditionNotes || 'None written.'}</p>

      <h4 className="pp-record__heading">Damage found ({record.damage.length})</h4>
      {record.damage.length ? (
        <ul className="pp-record__list pp-record__list--plain">
          {record.damage.map((d) => (
            <li key={d.number}>
              <strong>
                {d.number}. {d.kind}
              </strong>{' '}
              · {d.panel} · {d.severity}
              {d.note ? ` — ${d.note}` : ''}
              {d.photo ? ' · photo' : ''}
            </li>
          ))}
        </ul>
      ) : (
        <p className="pp-record__line">None marked.</p>
      )}

      <h4 className="pp-record__heading">Paint film readings</h4>
      <p className="pp-record__line">{record.film.baseline}</p>
      {record.film.panels.length ? (
        <ul className="pp-record__list">
          {record.film.panels.map((p) => (
            <li key={p.panel}>
              <strong>{p.panel}</strong>: {p.mean}
              {p.spots.length > 1 ? ` (spots ${p.spots.join(', ')})` : ''}
              {p.flags.length ? ` — ${p.flags.join(', ')}` : ''}
              {p.why.length ? <span className="pp-record__why">{p.why.join(' ')}</span> : null}
            </li>
          ))}
        </ul>
      ) : null}

      <h4 className="pp-record__heading">Photos ({record.photos.length})</h4>
      {record.photos.length ? (
        <div className="pp-record__photos">
          {record.photos.map((p, i) => (
            <RecordPhoto
              key={p.sha256}
              sha256={p.sha256}
              label={`${p.kind === 'damage' ? 'Damage' : 'Before'} photo ${i + 1}`}
            />
          ))}
        </div>
      ) : (
        <p className="pp-record__line">No photos.</p>
      )}
    </article>
  );
}
