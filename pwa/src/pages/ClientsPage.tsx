import { IonPage, IonRouterOutlet } from '@ionic/react';
import { lazy, Suspense } from 'react';
import { Route } from 'react-router-dom';
import { lazyPage } from '../app/lazyPage';
import { TabPage } from '../features/shell/components/TabPage';

const ClientsScreen = lazy(() => import('../features/clients/components/ClientsScreen'));
const CustomerPage = lazyPage(() => import('../features/clients/components/CustomerPage'));
const VehiclePage = lazyPage(() => import('../features/clients/components/VehiclePage'));

function ClientsListPage() {
  return (
    <TabPage title="Clients">
      <Suspense fallback={<div className="pp-loading" aria-busy="true" />}>
        <ClientsScreen />
      </Suspense>
    </TabPage>
  );
}

/**
 * The Clients tab: `/clients` lists customers (search by name, phone, e-mail or plate),
 * `/clients/:customerId` opens one, `/clients/vehicles/:vehicleId` a vehicle's history. All
 * read from the phone's database: offline, deep links and reloads work.
 */
export default function ClientsPage() {
  return (
    <IonPage>
      <IonRouterOutlet>
        <Route index element={<ClientsListPage />} />
        <Route path="vehicles/:vehicleId" element={<VehiclePage />} />
        <Route path=":customerId" element={<CustomerPage />} />
      </IonRouterOutlet>
    </IonPage>
  );
}
