import type { AcceptanceRecord } from '../model/handoverSummary';

function untilWords(iso: string): string {
  const at = new Date(iso);
  if (Number.isNaN(at.getTime())) return iso;
  const time = at.toLocaleTimeString(undefined, { hour: '2-digit', minute: '2-digit' });
  const day = at.toLocaleDateString(undefined, {
    weekday: 'short',
    day: 'numeric',
    month: 'short',
  });
  return `${time} ${day}`;
}

/** The work done, drawn from the acceptance record alone (what is shown is what is signed). */
export function AcceptanceView({ record }: { record: AcceptanceRecord }) {
  return (
    <div className="pp-hand-record">
      <p className="pp-hand-record__car">
        <strong>{record.vehicle}</strong>
        {record.address ? <span> · {record.address}</span> : null}
      </p>
      <h3 className="pp-hand-record__h">Paint correction</h3>
      {record.panels.length === 0 ? (
        <p className="pp-section-hint">No machine passes were logged.</p>
      ) : (
        <ul className="pp-hand-record__list">
          {record.panels.map((p) => (
            <li key={p.panel}>
              <strong>{p.panel}</strong>: {p.passes.join('; ')}
            </li>
          ))}
        </ul>
      )}
      <h3 className="pp-hand-record__h">Stone chips</h3>
      {record.chips.length === 0 ? (
        <p className="pp-section-hint">No chips were filled.</p>
      ) : (
        <ul className="pp-hand-record__list">
          {record.chips.map((c) => (
            <li key={c.number}>
              Chip {c.number} on {c.panel}: {c.layers}
            </li>
          ))}
        </ul>
      )}
      <h3 className="pp-hand-record__h">Protection</h3>
      {record.protection.length === 0 ? (
        <p className="pp-section-hint">No protection with a keep-dry window.</p>
      ) : (
        <ul className="pp-hand-record__list">
          {record.protection.map((p) => (
            <li key={`${p.label}-${p.keepDryUntil}`}>
              {p.label}: keep dry until {untilWords(p.keepDryUntil)}
            </li>
          ))}
        </ul>
      )}
      <p className="pp-hand-record__photos">
        {record.photos === 1 ? '1 photo' : `${record.photos} photos`} taken on this visit.
      </p>
    </div>
  );
}
