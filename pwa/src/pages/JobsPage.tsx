import { EmptyState } from '../components/EmptyState';
import { TabPage } from '../features/shell/components/TabPage';

export default function JobsPage() {
  return (
    <TabPage title="Jobs">
      <EmptyState title="No jobs yet">
        <p>Booked and finished jobs are listed here, newest first.</p>
      </EmptyState>
    </TabPage>
  );
}
