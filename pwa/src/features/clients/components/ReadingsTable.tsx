import type { ReadingsHistory } from '../model/readings';

const PHASE_WORDS: Record<string, string> = { before: 'before', after: 'after' };

/** The chart's numbers as a table: a row per panel, a column per visit and phase. */
export function ReadingsTable({
  history,
  formatThickness,
  unitSymbol,
}: {
  history: ReadingsHistory;
  formatThickness: (um: number) => string;
  unitSymbol: string;
}) {
  const date = (ms: number) =>
    new Date(ms).toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
  return (
    <div className="pp-office-scroll">
      <table className="pp-office-table">
        <caption>Mean film per panel ({unitSymbol}), each visit</caption>
        <thead>
          <tr>
            <th scope="col">Panel</th>
            {history.visits.map((v) => (
              <th key={v.key} scope="col" className="pp-num">
                {date(v.atMs)}, {PHASE_WORDS[v.phase] ?? v.phase}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {history.panels.map((p) => (
            <tr key={p.panelKey}>
              <th scope="row">{p.label}</th>
              {p.values.map((v, i) => (
                <td key={history.visits[i]!.key} className="pp-num">
                  {v === null ? (
                    <>
                      <span aria-hidden="true">—</span>
                      <span className="pp-stage-sr">not measured</span>
                    </>
                  ) : (
                    formatThickness(v)
                  )}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
