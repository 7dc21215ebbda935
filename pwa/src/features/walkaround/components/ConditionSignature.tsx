import { lazy, Suspense, useEffect, useState } from 'react';
import { Notice } from '../../../components/Notice';
import { recordHash } from '../../../db/images';
import { useImageUrl } from '../../photos';
import type { WalkaroundData } from '../hooks/useWalkaround';
import { shortHash, type ConditionRecord } from '../model/conditionRecord';
import { signedWhen } from '../../prep/kit/time';

const SignatureSheet = lazy(() =>
  import('./SignatureSheet').then((m) => ({ default: m.SignatureSheet })),
);

/**
 * The owner's signature on the condition record. Once signed: who and when, the record's
 * hash (short), the signature itself — never editable; if the record has changed since, it
 * says so and a new signature can be taken.
 */
export function ConditionSignature({
  data,
  record,
}: {
  data: WalkaroundData;
  record: ConditionRecord;
}) {
  const [open, setOpen] = useState(false);
  // Mounted from the first opening on, so the sheet can close with its own animation.
  const [loaded, setLoaded] = useState(false);
  const [hash, setHash] = useState<string | null>(null);
  const latest = data.signatures[0] ?? null;
  const image = useImageUrl(latest?.imageSha256);

  useEffect(() => {
    let live = true;
    void recordHash(record).then((h) => {
      if (live) setHash(h);
    });
    return () => {
      live = false;
    };
  }, [record]);

  const changed = latest !== null && hash !== null && hash !== latest.recordHash;

  return (
    <div className="pp-signature">
      {latest ? (
        <div className="pp-signed">
          <Notice tone="done">
            Signed by {latest.signerName} at {signedWhen(latest.signedAt)}.
          </Notice>
          <p className="pp-signed__hash">
            Record <span className="pp-mono">{shortHash(latest.recordHash)}</span>
            <span className="pp-visually-hidden"> (start of its SHA-256 fingerprint)</span>
          </p>
          {image ? (
            <img
              className="pp-signed__image"
              src={image}
              alt={`Signature of ${latest.signerName}`}
            />
          ) : image === null ? (
            <p className="pp-section-hint">
              The signature image was taken on another phone; it is kept on the server.
            </p>
          ) : null}
          {changed ? (
            <Notice tone="wait">
              The record has changed since it was signed (now{' '}
              <span className="pp-mono">{shortHash(hash)}</span>). The signature stays as it was;
              take a new one if the owner should sign the changes.
            </Notice>
          ) : null}
          {data.signatures.length > 1 ? (
            <p className="pp-section-hint">
              {data.signatures.length - 1} earlier{' '}
              {data.signatures.length === 2 ? 'signature is' : 'signatures are'} kept as well.
            </p>
          ) : null}
        </div>
      ) : (
        <p className="pp-section-hint">
          Walk round the car with the owner, then let them read the record and sign it on this
          phone.
        </p>
      )}
      {data.readOnly ? null : (
        <button
          type="button"
          className={latest ? 'pp-button pp-button--quiet-go' : 'pp-button'}
          onClick={() => {
            setLoaded(true);
            setOpen(true);
          }}
        >
          {latest ? 'Take a new signature' : "Take the owner's signature"}
        </button>
      )}
      {loaded ? (
        <Suspense fallback={null}>
          <SignatureSheet
            isOpen={open}
            jobId={data.job.id}
            record={record}
            onClose={() => setOpen(false)}
          />
        </Suspense>
      ) : null}
    </div>
  );
}
