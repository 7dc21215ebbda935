import { EmptyState } from '../components/EmptyState';
import { TabPage } from '../features/shell/components/TabPage';

export default function LedgerPage() {
  return (
    <TabPage title="Ledger">
      <EmptyState title="Nothing in the ledger yet">
        <p>Quotes, payments taken and money still owed, for the owner&apos;s eyes only.</p>
      </EmptyState>
    </TabPage>
  );
}
