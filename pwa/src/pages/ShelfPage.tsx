import { EmptyState } from '../components/EmptyState';
import { TabPage } from '../features/shell/components/TabPage';

export default function ShelfPage() {
  return (
    <TabPage title="Shelf">
      <EmptyState title="Nothing on the shelf yet">
        <p>Compounds, pads, coatings and touch-up paint, with what is left of each.</p>
      </EmptyState>
    </TabPage>
  );
}
