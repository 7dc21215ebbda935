import { useMemo } from 'react';
import { useParams, useSearchParams } from 'react-router-dom';
import { Notice } from '../../components/Notice';
import { OwnerOnly } from './components/OwnerOnly';
import { QuoteBuilder } from './components/QuoteBuilder';
import { SubPage } from './components/SubPage';
import { useQuoteSettings } from './hooks/useQuoteSettings';
import './quotes.css';

/**
 * `/jobs/quotes/new` (optionally `?customer=…&vehicle=…`) and `/jobs/quotes/:quoteId`: the
 * quote builder, priced from the business's settings kept on the phone.
 */
export default function QuoteBuilderPage() {
  const { quoteId } = useParams<{ quoteId: string }>();
  const [search] = useSearchParams();
  const id = quoteId && quoteId !== 'new' ? quoteId : null;
  const customerId = search.get('customer') ?? undefined;
  const vehicleId = search.get('vehicle') ?? undefined;
  const preset = useMemo(
    () => ({
      ...(customerId ? { customerId } : {}),
      ...(vehicleId ? { vehicleId } : {}),
    }),
    [customerId, vehicleId],
  );
  const { settings, source, loading } = useQuoteSettings();
  return (
    <SubPage
      title={id ? 'Quote' : 'New quote'}
      backTo="/jobs/quotes"
      backLabel="Back to the quotes"
    >
      <OwnerOnly>
        {settings ? (
          <>
            {source === 'kept' ? (
              <Notice tone="info">
                Priced with your settings as this phone last saw them (no signal now).
              </Notice>
            ) : null}
            <QuoteBuilder key={id ?? 'new'} quoteId={id} settings={settings} preset={preset} />
          </>
        ) : loading ? (
          <div className="pp-loading" aria-busy="true" />
        ) : (
          <Notice tone="stop">
            Your prices have not reached this phone yet. Open a quote once with a signal; after
            that, quotes can be priced here with none.
          </Notice>
        )}
      </OwnerOnly>
    </SubPage>
  );
}
