import { EmptyState } from '../components/EmptyState';
import { TabPage } from '../features/shell/components/TabPage';

export default function ClientsPage() {
  return (
    <TabPage title="Clients">
      <EmptyState title="No clients yet">
        <p>Each client&apos;s cars, past visits and notes will be kept here.</p>
      </EmptyState>
    </TabPage>
  );
}
