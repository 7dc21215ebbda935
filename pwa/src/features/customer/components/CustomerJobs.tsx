import { useState } from 'react';
import { Notice } from '../../../components/Notice';
import type { JobDocument } from '../api/customerApi';
import { useCustomerJobs, useJobDocuments } from '../hooks/useCustomerJobs';
import { useOpenDocument } from '../hooks/useOpenDocument';
import { usePayment } from '../hooks/usePayment';
import { dueWords, stageWords, type CustomerJob } from '../model/customerWords';
import { problemWords } from '../model/problemWords';
import { windowWords } from '../model/quoteRecord';
import { ConditionRecordSheet } from './ConditionRecordSheet';

function DocumentLink({ doc }: { doc: JobDocument }) {
  const open = useOpenDocument(doc.url);
  return (
    <>
      <button
        type="button"
        className="pp-cust-quiet"
        disabled={open.isPending}
        onClick={() => open.mutate()}
      >
        {open.isPending ? `Opening ${doc.title}…` : `${doc.title} (PDF)`}
      </button>
      {open.error ? (
        <Notice tone="stop">{doc.title} did not open. Try again when there is a signal.</Notice>
      ) : null}
    </>
  );
}

function JobCard({ job, currency }: { job: CustomerJob; currency: string | undefined }) {
  const docs = useJobDocuments(job.id);
  const pay = usePayment(job.id);
  const [record, setRecord] = useState(false);
  const headingId = `pp-cust-job-${job.id}`;

  return (
    <section className="pp-cust-job" aria-labelledby={headingId}>
      <h3 id={headingId} className="pp-cust-job__title">
        {job.vehicleLabel}
      </h3>
      <p className="pp-cust-hint">
        {windowWords(new Date(job.windowStart), new Date(job.windowEnd))} · {stageWords(job.stage)}
      </p>
      <p className="pp-cust-job__due">{dueWords(job, currency)}</p>
      {job.amountDueMinor > 0 && job.stage !== 'booked' ? (
        <>
          {pay.error ? (
            <Notice tone="stop">{problemWords(pay.error, 'The payment page did not open.')}</Notice>
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
      <div className="pp-cust-job__docs">
        {job.stage !== 'booked' ? (
          <>
            <button type="button" className="pp-cust-quiet" onClick={() => setRecord(true)}>
              Condition record
            </button>
            <ConditionRecordSheet jobId={job.id} isOpen={record} onClose={() => setRecord(false)} />
          </>
        ) : null}
        {docs.data ? (
          <>
            <DocumentLink doc={docs.data.report} />
            {docs.data.invoice ? <DocumentLink doc={docs.data.invoice} /> : null}
          </>
        ) : docs.error ? (
          <p className="pp-cust-hint">The documents could not be listed just now.</p>
        ) : null}
      </div>
    </section>
  );
}

/** The customer's own visits, newest first: when, what is due, paying, the records. */
export function CustomerJobs({
  userId,
  currency,
}: {
  userId: string;
  currency: string | undefined;
}) {
  const jobs = useCustomerJobs(userId);
  if (jobs.isPending) return <div className="pp-loading" aria-busy="true" />;
  if (jobs.error)
    return <Notice tone="stop">{problemWords(jobs.error, 'Your visits did not load.')}</Notice>;
  const items = [...jobs.data.items].sort((a, b) => b.windowStart.localeCompare(a.windowStart));
  if (items.length === 0) {
    return <p className="pp-cust-hint">There are no visits to show yet.</p>;
  }
  return (
    <div className="pp-cust-jobs">
      {items.map((job) => (
        <JobCard key={job.id} job={job} currency={currency} />
      ))}
    </div>
  );
}
