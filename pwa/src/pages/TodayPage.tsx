import { EmptyState } from '../components/EmptyState';
import { TabPage } from '../features/shell/components/TabPage';

export default function TodayPage() {
  return (
    <TabPage title="Today">
      <EmptyState title="No jobs today yet">
        <p>Today&apos;s cars show up here in order, with the address and the time you are due.</p>
      </EmptyState>
    </TabPage>
  );
}
