import { QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '../../../app/queryClient';
import { Notice } from '../../../components/Notice';
import { useCustomerArea } from '../hooks/useCustomerArea';
import { useOnline } from '../../../app/useOnline';
import { CustomerJobs } from './CustomerJobs';
import { CustomerQuotes } from './CustomerQuotes';

/**
 * The customer's page: their quotes to answer, their visits with what is due and the records.
 * It works online only (no copy is kept on the customer's phone), and says so when offline.
 * The page is outside the tab shell, so it brings the app's query client itself.
 */
export function CustomerArea({ userId, name }: { userId: string; name: string }) {
  return (
    <QueryClientProvider client={queryClient}>
      <AreaBody userId={userId} name={name} />
    </QueryClientProvider>
  );
}

function AreaBody({ userId, name }: { userId: string; name: string }) {
  const online = useOnline();
  const area = useCustomerArea(userId);
  const business = area.data?.business.name ?? 'your detailer';
  const customerName = area.data?.customer.name ?? name;
  return (
    <>
      <h2 className="pp-cust-hello">Hello{customerName ? `, ${customerName}` : ''}</h2>
      <p className="pp-cust-hint">
        Your quotes and visits with {business}: accept a quote, see what is left to pay, the
        condition of your car on arrival, the job report and the invoice.
      </p>
      {!online ? (
        <Notice tone="wait">
          This phone is offline. This page needs a signal to show and send your answers; nothing is
          lost meanwhile.
        </Notice>
      ) : null}
      <section className="pp-cust-section" aria-labelledby="pp-cust-quotes-title">
        <h2 id="pp-cust-quotes-title" className="pp-cust-section__title">
          Quotes
        </h2>
        <CustomerQuotes
          userId={userId}
          business={business}
          customerName={customerName}
          online={online}
        />
      </section>
      <section className="pp-cust-section" aria-labelledby="pp-cust-visits-title">
        <h2 id="pp-cust-visits-title" className="pp-cust-section__title">
          Visits
        </h2>
        <CustomerJobs userId={userId} currency={area.data?.business.currency} />
      </section>
    </>
  );
}
