import { IonPage, IonRouterOutlet } from '@ionic/react';
import { lazy, Suspense } from 'react';
import { Route } from 'react-router-dom';
import { lazyPage } from '../app/lazyPage';
import { TabPage } from '../features/shell/components/TabPage';

const ShelfScreen = lazy(() => import('../features/shelf/components/ShelfScreen'));
const ProductPage = lazyPage(() => import('../features/shelf/components/ProductPage'));

function ShelfListPage() {
  return (
    <TabPage title="Shelf">
      <Suspense fallback={<div className="pp-loading" aria-busy="true" />}>
        <ShelfScreen />
      </Suspense>
    </TabPage>
  );
}

/**
 * The Shelf tab: `/shelf` lists products and tools (low stock first), `/shelf/:id` opens one.
 * Read from the phone's database, so both work offline, as deep links and after a reload.
 */
export default function ShelfPage() {
  return (
    <IonPage>
      <IonRouterOutlet>
        <Route index element={<ShelfListPage />} />
        <Route path=":id" element={<ProductPage />} />
      </IonRouterOutlet>
    </IonPage>
  );
}
