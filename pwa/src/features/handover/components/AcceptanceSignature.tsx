import { lazy, Suspense, useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { recordHash } from '../../../db/images';
import { useImageUrl } from '../../photos';
import type { SignatureWords } from '../../walkaround/components/SignatureSheet';
import { shortHash } from '../../walkaround/model/conditionRecord';
import type { HandoverData } from '../hooks/useHandover';
import type { AcceptanceRecord } from '../model/handoverSummary';
import { AcceptanceView } from './AcceptanceView';
import { signedWhen } from '../../prep/kit/time';

// The walkaround's signing sheet (and its pad) is loaded only when it is first opened.
const SignatureSheet = lazy(() =>
  import('../../walkaround/components/SignatureSheet').then((m) => ({
    default: m.SignatureSheet<AcceptanceRecord>,
  })),
);

const ACCEPTANCE_WORDS: SignatureWords<AcceptanceRecord> = {
  kind: 'acceptance',
  title: 'Accept the work',
  intro:
    'Please read what was done to your car today. Signing says you have seen the car and accept the work as finished.',
  signLabel: 'Sign and accept the work',
  view: (record) => <AcceptanceView record={record} />,
};

/**
 * The customer's acceptance signature over the summary of the work: who, when and the start
 * of the summary's hash once signed; never editable, and a new one can be taken if the work
 * changed since.
 */
export function AcceptanceSignature({ data }: { data: HandoverData }) {
  const [open, setOpen] = useState(false);
  const [loaded, setLoaded] = useState(false);
  const [hash, setHash] = useState<string | null>(null);
  const latest = data.signatures[0] ?? null;
  const image = useImageUrl(latest?.imageSha256);

  useEffect(() => {
    let live = true;
    void recordHash(data.record).then((h) => {
      if (live) setHash(h);
    });
    return () => {
      live = false;
    };
  }, [data.record]);

  const changed = latest !== null && hash !== null && hash !== latest.recordHash;

  return (
    <div className="pp-signature">
      {latest ? (
        <div className="pp-signed">
          <Notice tone="done">
            Accepted by {latest.signerName} at {signedWhen(latest.signedAt)}.
          </Notice>
          <p className="pp-signed__hash">
            Summary <span className="pp-mono">{shortHash(latest.recordHash)}</span>
            <span className="pp-visually-hidden"> (start of its SHA-256 fingerprint)</span>
          </p>
          {image ? (
            <img
              className="pp-signed__image"
              src={image}
              alt={`Signature of ${latest.signerName}`}
            />
          ) : null}
          {changed ? (
            <Notice tone="wait">
              The work has changed since it was signed (now{' '}
              <span className="pp-mono">{shortHash(hash)}</span>). The signature stays as it was;
              take a new one if the customer should accept the changes.
            </Notice>
          ) : null}
        </div>
      ) : (
        <p className="pp-section-hint">
          Show the customer the car and this summary, then let them sign on this phone.
        </p>
      )}
      {data.readOnly ? null : data.job.stage !== 'handover' ? (
        // Signing locks the recorded work on the server: only once the work is done.
        <p className="pp-section-hint">
          The customer signs once the job has moved to Handover and the work is finished.
        </p>
      ) : (
        <button
          type="button"
          className={latest ? 'pp-button pp-button--quiet-go' : 'pp-button'}
          onClick={() => {
            setLoaded(true);
            setOpen(true);
          }}
        >
          {latest ? 'Take a new signature' : "Take the customer's signature"}
        </button>
      )}
      {loaded ? (
        <Suspense fallback={null}>
          <SignatureSheet
            isOpen={open}
            jobId={data.job.id}
            record={data.record}
            words={ACCEPTANCE_WORDS}
            onClose={() => setOpen(false)}
          />
        </Suspense>
      ) : null}
    </div>
  );
}
