import { QueryClientProvider, useMutation, useQuery } from '@tanstack/react-query';
import { useState } from 'react';
import { queryClient } from '../../../app/queryClient';
import { apiClient, sessionStore } from '../../../app/services';
import { Notice } from '../../../components/Notice';
import { isApiError, isNetworkError } from '../../../api/errors';
import {
  customerJobsQuery,
  fetchDocument,
  jobDocumentsQuery,
  requestPayment,
  type JobDocument,
} from '../api/customerApi';
import { dueWords, stageWords, visitDay, type CustomerJob } from '../model/customerWords';

function problem(error: unknown, fallback: string): string {
  if (isNetworkError(error)) return 'No connection. Try again when there is a signal.';
  if (isApiError(error)) return error.message;
  return fallback;
}

function DocumentLink({ doc }: { doc: JobDocument }) {
  const [state, setState] = useState<'idle' | 'busy' | 'failed'>('idle');
  async function open() {
    setState('busy');
    try {
      const blob = await fetchDocument(apiClient, sessionStore, doc.url);
      const url = URL.createObjectURL(blob);
      window.open(url, '_blank', 'noopener');
      // Long enough for the new tab to read it.
      setTimeout(() => URL.revokeObjectURL(url), 60_000);
      setState('idle');
    } catch {
      setState('failed');
    }
  }
  return (
    <>
      <button
        type="button"
        className="pp-button pp-button--quiet-go"
        disabled={state === 'busy'}
        onClick={() => void open()}
      >
        {state === 'busy' ? `Opening ${doc.title}…` : `${doc.title} (PDF)`}
      </button>
      {state === 'failed' ? (
        <Notice tone="stop">{doc.title} did not open. Try again when there is a signal.</Notice>
      ) : null}
    </>
  );
}

function JobCard({ job }: { job: CustomerJob }) {
  const docs = useQuery(jobDocumentsQuery(apiClient, job.id));
  // One id pair per payment: a retry after a lost answer asks for the same payment.
  const [ids] = useState(() => ({ id: crypto.randomUUID(), opId: crypto.randomUUID() }));
  const pay = useMutation({
    mutationFn: () => requestPayment(apiClient, job.id, ids),
    onSuccess: (answer) => {
      if (answer.checkoutUrl) window.location.assign(answer.checkoutUrl);
    },
  });
  const headingId = `pp-cust-job-${job.id}`;

  return (
    <section className="pp-cust-job" aria-labelledby={headingId}>
      <h2 id={headingId} className="pp-cust-job__title">
        {job.vehicleLabel}
      </h2>
      <p className="pp-cust-hint">
        {visitDay(job.windowStart)} · {stageWords(job.stage)}
      </p>
      <p className="pp-cust-job__due">{dueWords(job)}</p>
      {job.amountDueMinor > 0 && job.stage !== 'booked' ? (
        <>
          {pay.error ? (
            <Notice tone="stop">{problem(pay.error, 'The payment page did not open.')}</Notice>
          ) : null}
          <button
            type="button"
            className="pp-button"
            disabled={pay.isPending || pay.isSuccess}
            onClick={() => pay.mutate()}
          >
            {pay.isPending || pay.isSuccess ? 'Opening the payment page…' : 'Pay by card'}
          </button>
        </>
      ) : null}
      {docs.data ? (
        <div className="pp-cust-job__docs">
          <DocumentLink doc={docs.data.report} />
          {docs.data.invoice ? <DocumentLink doc={docs.data.invoice} /> : null}
        </div>
      ) : docs.error ? (
        <p className="pp-cust-hint">The documents could not be listed just now.</p>
      ) : null}
    </section>
  );
}

/**
 * The customer's own jobs, newest first: the amount due, paying by card, the documents. The
 * customer's page is outside the tab shell, so it brings the app's query client itself.
 */
export function CustomerJobs({ userId }: { userId: string }) {
  return (
    <QueryClientProvider client={queryClient}>
      <JobList userId={userId} />
    </QueryClientProvider>
  );
}

function JobList({ userId }: { userId: string }) {
  const jobs = useQuery(customerJobsQuery(apiClient, userId));
  if (jobs.isPending) return <div className="pp-loading" aria-busy="true" />;
  if (jobs.error)
    return <Notice tone="stop">{problem(jobs.error, 'Your visits did not load.')}</Notice>;
  const items = [...jobs.data.items].sort((a, b) => b.windowStart.localeCompare(a.windowStart));
  if (items.length === 0) {
    return <p className="pp-cust-hint">There are no visits to show yet.</p>;
  }
  return (
    <div className="pp-cust-jobs">
      {items.map((job) => (
        <JobCard key={job.id} job={job} />
      ))}
    </div>
  );
}
