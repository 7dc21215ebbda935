import { IonPage, IonRouterOutlet } from '@ionic/react';
import { lazy, Suspense } from 'react';
import { Route } from 'react-router-dom';
import { lazyPage } from '../app/lazyPage';
import { JobsTabLinks } from '../features/quotes/components/JobsTabLinks';
import { TabPage } from '../features/shell/components/TabPage';

const JobsList = lazy(() => import('../features/jobs/JobsList'));
const JobWorkspacePage = lazyPage(() => import('../features/workspace/JobWorkspacePage'));
const QuotesPage = lazyPage(() => import('../features/quotes/QuotesPage'));
const QuoteBuilderPage = lazyPage(() => import('../features/quotes/QuoteBuilderPage'));
const CalendarPage = lazyPage(() => import('../features/calendar/CalendarPage'));

/** The list of jobs, in the Jobs tab's page. */
function JobsListPage() {
  return (
    <TabPage title="Jobs">
      <JobsTabLinks />
      <Suspense fallback={<div className="pp-loading" aria-busy="true" />}>
        <JobsList />
      </Suspense>
    </TabPage>
  );
}

/**
 * The Jobs tab: `/jobs` lists every visit, `/jobs/:id` opens one job's workspace;
 * `/jobs/quotes` (and `/new`, `/:quoteId`) the owner's quotes, `/jobs/calendar` the bookings. The tab's
 * route is `/jobs/*`, so these paths are relative to it; both work as deep links and after
 * a reload.
 */
export default function JobsPage() {
  return (
    <IonPage>
      <IonRouterOutlet>
        <Route index element={<JobsListPage />} />
        <Route path="quotes" element={<QuotesPage />} />
        <Route path="quotes/:quoteId" element={<QuoteBuilderPage />} />
        <Route path="calendar" element={<CalendarPage />} />
        <Route path=":id" element={<JobWorkspacePage />} />
      </IonRouterOutlet>
    </IonPage>
  );
}
