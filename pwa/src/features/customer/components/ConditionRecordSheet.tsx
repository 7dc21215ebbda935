import { IonModal } from '@ionic/react';
import { IonButton, IonContent, IonHeader, IonToolbar } from '../../../components/ionic';
import { Notice } from '../../../components/Notice';
import { VehicleOutlineDrawing } from '../../outline/VehicleOutlineDrawing';
import {
  useConditionRecord,
  useCustomerImage,
  useFingerprintCheck,
} from '../hooks/useConditionRecord';
import {
  filmWords,
  flagWords,
  outlineWords,
  photoKindWords,
  pinWords,
  type ConditionRecord,
} from '../model/conditionRecordWords';
import { problemWords } from '../model/problemWords';
import { shortHash } from '../../../db/hashing';
import { signedWhen } from '../../prep/kit/time';

function RecordImage({ url, alt }: { url: string; alt: string }) {
  const image = useCustomerImage(url);
  if (image.src) return <img className="pp-cust-photo" src={image.src} alt={alt} />;
  return (
    <span className="pp-cust-photo pp-cust-photo--missing">
      {image.failed ? `${alt} did not load` : `Loading ${alt.toLowerCase()}…`}
    </span>
  );
}

function SignatureBlock({ signature }: { signature: ConditionRecord['signatures'][number] }) {
  const matches = useFingerprintCheck(signature.record, signature.recordHash);
  return (
    <li className="pp-cust-signature">
      <p className="pp-cust-signature__who">
        Signed by {signature.signerName} at {signedWhen(signature.signedAt)}
      </p>
      <RecordImage url={signature.imageUrl} alt={`Signature of ${signature.signerName}`} />
      <p className="pp-cust-hint">
        Fingerprint of the signed record (SHA-256):{' '}
        <span className="pp-cust-mono">{signature.recordHash}</span> (starts{' '}
        {shortHash(signature.recordHash)})
      </p>
      {matches === null ? (
        <p className="pp-cust-hint">Checking the fingerprint on this phone…</p>
      ) : matches ? (
        <Notice tone="done">
          Checked on this phone: the signed record matches its fingerprint.
        </Notice>
      ) : (
        <Notice tone="stop">
          The signed record does not match its fingerprint. Ask your detailer about it.
        </Notice>
      )}
    </li>
  );
}

function RecordBody({ record }: { record: ConditionRecord }) {
  const photos = record.photos;
  return (
    <>
      <h3 className="pp-cust-record__title">
        {record.vehicle.label}
        {record.vehicle.plate ? ` · ${record.vehicle.plate}` : ''}
      </h3>
      <section aria-labelledby="pp-cust-cr-notes" className="pp-cust-record__part">
        <h4 id="pp-cust-cr-notes">As found on arrival</h4>
        <p>{record.job.conditionNotes.trim() || 'No condition notes were written.'}</p>
      </section>
      <section aria-labelledby="pp-cust-cr-marks" className="pp-cust-record__part">
        <h4 id="pp-cust-cr-marks">Marks on the vehicle ({record.pins.length})</h4>
        <VehicleOutlineDrawing
          bodyStyle={record.vehicle.bodyStyle}
          pins={record.pins}
          description={outlineWords(record)}
        />
        {record.pins.length ? (
          <ol className="pp-cust-list" aria-label="Marks found">
            {record.pins.map((pin) => (
              <li key={pin.id} value={pin.number}>
                {pinWords(pin)}
              </li>
            ))}
          </ol>
        ) : (
          <p className="pp-cust-hint">No marks were pinned.</p>
        )}
      </section>
      <section aria-labelledby="pp-cust-cr-photos" className="pp-cust-record__part">
        <h4 id="pp-cust-cr-photos">Photos ({photos.length})</h4>
        {photos.length ? (
          <div className="pp-cust-photos">
            {photos.map((p, i) => (
              <figure key={p.id} className="pp-cust-photos__item">
                <RecordImage url={p.url} alt={`${photoKindWords(p.kind)}, photo ${i + 1}`} />
                <figcaption>{p.caption || photoKindWords(p.kind)}</figcaption>
              </figure>
            ))}
          </div>
        ) : (
          <p className="pp-cust-hint">No photos were taken.</p>
        )}
      </section>
      <section aria-labelledby="pp-cust-cr-film" className="pp-cust-record__part">
        <h4 id="pp-cust-cr-film">Paint film readings</h4>
        {record.panels.length ? (
          <table className="pp-cust-figures">
            <caption className="pp-cust-figures__caption">
              Mean of the gauge readings on each panel, before and after the work
            </caption>
            <thead>
              <tr>
                <th scope="col">Panel</th>
                <th scope="col" className="pp-cust-figures__amount">
                  Before
                </th>
                <th scope="col" className="pp-cust-figures__amount">
                  After
                </th>
                <th scope="col" className="pp-cust-figures__amount">
                  Taken off
                </th>
              </tr>
            </thead>
            <tbody>
              {record.panels.map((p) => (
                <tr key={p.id}>
                  <th scope="row">
                    {p.label}
                    {p.flags.length ? (
                      <span className="pp-cust-flag"> ({flagWords(p.flags)})</span>
                    ) : null}
                  </th>
                  <td className="pp-cust-figures__amount">
                    {filmWords(p.beforeUm, record.thicknessUnit)}
                  </td>
                  <td className="pp-cust-figures__amount">
                    {filmWords(p.afterUm, record.thicknessUnit)}
                  </td>
                  <td className="pp-cust-figures__amount">
                    {filmWords(p.removedUm, record.thicknessUnit)}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        ) : (
          <p className="pp-cust-hint">No film readings were taken.</p>
        )}
      </section>
      <section aria-labelledby="pp-cust-cr-signed" className="pp-cust-record__part">
        <h4 id="pp-cust-cr-signed">Signature</h4>
        {record.signatures.length ? (
          <ul className="pp-cust-signatures">
            {record.signatures.map((s) => (
              <SignatureBlock key={s.id} signature={s} />
            ))}
          </ul>
        ) : (
          <p className="pp-cust-hint">The condition record has not been signed.</p>
        )}
      </section>
    </>
  );
}

/** The walkaround record of a visit, read-only: as found, the marks, photos, film, signature. */
export function ConditionRecordSheet({
  jobId,
  isOpen,
  onClose,
}: {
  jobId: string;
  isOpen: boolean;
  onClose: () => void;
}) {
  const record = useConditionRecord(jobId, isOpen);
  return (
    <IonModal isOpen={isOpen} onDidDismiss={onClose} aria-label="Condition record">
      <IonHeader>
        <IonToolbar>
          <div className="pp-header">
            <h2 className="pp-header__title">Condition record</h2>
            <IonButton fill="clear" onClick={onClose}>
              Close
            </IonButton>
          </div>
        </IonToolbar>
      </IonHeader>
      <IonContent>
        <div className="pp-page pp-cust-sheet">
          {record.data ? (
            <RecordBody record={record.data} />
          ) : record.error ? (
            <Notice tone="stop">
              {problemWords(record.error, 'The condition record did not load.')}
            </Notice>
          ) : (
            <p className="pp-cust-hint" role="status" aria-busy="true">
              Loading the condition record…
            </p>
          )}
          <button type="button" className="pp-cust-quiet" onClick={onClose}>
            Close the record
          </button>
        </div>
      </IonContent>
    </IonModal>
  );
}
