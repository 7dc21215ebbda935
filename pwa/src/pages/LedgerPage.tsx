import { useSearchParams } from 'react-router-dom';
import { LedgerScreen } from '../features/ledger/components/LedgerScreen';
import { isMonth, monthOf, type Month } from '../features/ledger/model/ledgerModel';
import { TabPage } from '../features/shell/components/TabPage';

/**
 * The Ledger (owner only): one month at a time, kept in the address (`/ledger?month=2026-03`)
 * so a reload or a shared link opens the same month; this month when none is given.
 */
export default function LedgerPage() {
  const [params, setParams] = useSearchParams();
  const asked = params.get('month');
  const month: Month = isMonth(asked) ? asked : monthOf(new Date());
  return (
    <TabPage title="Ledger">
      <LedgerScreen month={month} onMonth={(m) => setParams({ month: m }, { replace: true })} />
    </TabPage>
  );
}
