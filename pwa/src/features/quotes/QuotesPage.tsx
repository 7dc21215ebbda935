import { SubPage } from './components/SubPage';
import { QuotesList } from './components/QuotesList';
import { OwnerOnly } from './components/OwnerOnly';
import './quotes.css';

/** `/jobs/quotes`: every quote with its status; New quote. */
export default function QuotesPage() {
  return (
    <SubPage title="Quotes" backTo="/jobs" backLabel="Back to the jobs">
      <OwnerOnly>
        <QuotesList />
      </OwnerOnly>
    </SubPage>
  );
}
