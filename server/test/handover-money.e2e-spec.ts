import { randomUUID } from 'node:crypto';
import { DataSource } from 'typeorm';
import { CaptureSmtp } from '../src/fakes/smtp/capture-smtp';
import { MailOutbox } from '../src/mail/mail-outbox.service';
import { signatureHeader } from '../src/fakes/stripe/signature';
import { TEST_CARDS } from '../src/fakes/stripe/payment-page';
import { makeJob } from './factories/records';
import { addTech, http, type Session, signUpOwner } from './support/app';
import {
  acceptanceSignature,
  bearer,
  eventually,
  mailOf,
  type MoneyWorld,
  moveTo,
  payOnPage,
  pdfText,
  startMoneyWorld,
  upload,
  WEBHOOK_SECRET,
} from './support/money';

/**
 * Handover and money, end to end: the real stripe SDK against the fake Stripe, signed
 * webhooks back into the app, the job closing with its invoice, and the customer's e-mails
 * arriving in the capturing SMTP server with their PDFs.
 */
describe('handover and money', () => {
  let w: MoneyWorld;
  let owner: Session;
  let tech: Session;

  beforeAll(async () => {
    w = await startMoneyWorld();
    owner = await signUpOwner(w.app, 'money-owner');
    tech = await addTech(w.app, owner, 'money-tech');
  });
  afterAll(async () => {
    await w.close();
  });

  const ds = () => w.app.get(DataSource);
  const paymentsOf = (jobId: string) =>
    ds().query<
      {
        id: string;
        status: string;
        failure_reason: string | null;
        amount_minor: number;
        kind: string;
      }[]
    >(
      'SELECT id, status, failure_reason, amount_minor, kind FROM payments WHERE job_id = $1 ORDER BY created_at',
      [jobId],
    );
  const sessionsFor = (opId: string) =>
    [...w.stripe.sessions.values()].filter((s) => s.client_reference_id === opId);
  const request = (s: Session, jobId: string, body: object) =>
    http(w.app).post(`/api/jobs/${jobId}/payment-requests`).auth(s.accessToken, bearer).send(body);
  const jobAt = async (stage: string, priceMinor = 48_000) => {
    const fixture = await makeJob(w.app, owner, { techId: tech.user.id, priceMinor });
    await moveTo(w.app, owner, fixture.jobId, stage);
    return fixture;
  };
  const getJob = async (jobId: string) =>
    (await http(w.app).get(`/api/jobs/${jobId}`).auth(owner.accessToken, bearer).expect(200))
      .body as { stage: string; amountDueMinor: number };

  it('refuses a webhook whose signature does not match, and takes a well-signed one', async () => {
    const body = JSON.stringify({
      id: 'evt_forged',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { id: 'cs_test_x', metadata: { businessId: owner.user.businessId } } },
    });
    const t = Math.floor(Date.now() / 1000);
    const wrong = await http(w.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signatureHeader(body, 'whsec_someone_else', t))
      .send(body)
      .expect(400);
    expect(wrong.body).toMatchObject({ statusCode: 400, code: 'bad-signature' });
    await http(w.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .send(body)
      .expect(400);
    // The same bytes with one character changed after signing.
    const tampered = await http(w.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signatureHeader(body, WEBHOOK_SECRET, t))
      .send(body.replace('cs_test_x', 'cs_test_y'))
      .expect(400);
    expect(tampered.body.code).toBe('bad-signature');
    const good = await http(w.app)
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signatureHeader(body, WEBHOOK_SECRET, t))
      .send(body)
      .expect(200);
    expect(good.body).toEqual({ received: true, outcome: 'unknown-payment' });
    const events = await ds().query('SELECT id FROM payment_events WHERE id = $1', ['evt_forged']);
    expect(events).toHaveLength(1);
  });

  it('takes the balance by card: QR link, the fake page, a signed webhook; the job closes with its invoice and e-mails', async () => {
    const { jobId } = await jobAt('handover');
    const image = await upload(w.app, owner, 101);
    await http(w.app)
      .post('/api/photos')
      .auth(owner.accessToken, bearer)
      .send({
        id: randomUUID(),
        jobId,
        kind: 'after',
        sha256: image,
        mime: 'image/png',
        width: 2,
        height: 2,
        bytes: 80,
        caption: 'Hood after correction',
      })
      .expect(201);
    const signature = await acceptanceSignature(w.app, owner, jobId, image);

    // The helper asks for the balance on site; the default amount is what is due.
    const asked = await request(tech, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(201);
    expect(asked.body.payment).toMatchObject({
      kind: 'balance',
      method: 'card',
      status: 'pending',
      amountMinor: 48_000,
    });
    expect(asked.body.checkoutUrl).toMatch(new RegExp(`^${w.stripe.url}/pay/cs_test_`));
    expect(asked.body.qrPng).toMatch(/^data:image\/png;base64,/);
    expect(asked.body.qrSvg).toMatch(/^data:image\/svg\+xml;base64,/);

    const paid = await payOnPage(asked.body.checkoutUrl as string, TEST_CARDS.succeeds);
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`http://127.0.0.1:5999/paid?job=${jobId}`);
    await w.stripe.settled();

    const job = await getJob(jobId);
    expect(job).toMatchObject({ stage: 'closed', amountDueMinor: 0 });
    expect(await paymentsOf(jobId)).toMatchObject([{ status: 'succeeded', kind: 'balance' }]);
    const [invoice] = await ds().query<{ id: string; number: number; total_minor: number }[]>(
      'SELECT id, number, total_minor FROM invoices WHERE job_id = $1',
      [jobId],
    );
    expect(invoice).toMatchObject({ total_minor: 48_000 });

    // The receipt and the report reach the customer, each with its PDF.
    const mails = await eventually(
      async () => {
        const list = (await mailOf(w.smtp, owner.user.businessId)).filter((m) =>
          m.headers.some((h) => h.name === 'Message-ID'),
        );
        const mine = list.filter((m) => m.to.includes('ada@customers.example'));
        const receipt = mine.find((m) => m.subject.startsWith('Receipt'));
        const report = mine.find((m) => m.subject.startsWith('Your job report'));
        return receipt && report ? { receipt, report } : null;
      },
      15_000,
      'the receipt and the report',
    );
    expect(mails.receipt.attachments).toEqual([
      expect.objectContaining({
        contentType: 'application/pdf',
        filename: expect.stringMatching(/^receipt-\d{5}\.pdf$/),
      }),
    ]);
    expect(mails.report.attachments).toEqual([
      expect.objectContaining({
        contentType: 'application/pdf',
        filename: expect.stringMatching(/^job-report-.*\.pdf$/),
      }),
    ]);
    expect(mails.report.text).toContain('Looking after the finish');
    const receiptPdf = (await w.smtp.store.attachment(mails.receipt.id, 0))!.content;
    const reportPdf = (await w.smtp.store.attachment(mails.report.id, 0))!.content;
    expect(receiptPdf.subarray(0, 5).toString()).toBe('%PDF-');
    expect(reportPdf.subarray(0, 5).toString()).toBe('%PDF-');
    const number = String(invoice!.number).padStart(5, '0');
    expect(pdfText(receiptPdf)).toContain(`Receipt no. ${number}`);
    expect(pdfText(receiptPdf)).toContain('Paid in full');
    const reportText = pdfText(reportPdf);
    expect(reportText).toContain('Job report');
    expect(reportText).toContain(signature.recordHash);

    // The owner's dev inbox lists them and hands out the PDFs.
    const inbox = await http(w.app)
      .get('/api/dev/mail')
      .auth(owner.accessToken, bearer)
      .expect(200);
    const listed = (inbox.body.items as { id: string; subject: string }[]).find(
      (m) => m.id === mails.receipt.id,
    );
    expect(listed).toBeDefined();
    const one = await http(w.app)
      .get(`/api/dev/mail/${mails.receipt.id}`)
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(one.body.attachments[0]).toMatchObject({ contentType: 'application/pdf' });
    const file = await http(w.app)
      .get(one.body.attachments[0].url as string)
      .auth(owner.accessToken, bearer)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      })
      .expect(200);
    expect((file.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    const stranger = await signUpOwner(w.app, 'money-stranger');
    await http(w.app)
      .get(`/api/dev/mail/${mails.receipt.id}`)
      .auth(stranger.accessToken, bearer)
      .expect(404);
  });

  it('records a webhook delivered twice as one payment', async () => {
    const { jobId } = await jobAt('handover', 30_000);
    w.stripe.setDuplicateRate(1);
    try {
      const asked = await request(owner, jobId, {
        id: randomUUID(),
        opId: randomUUID(),
        kind: 'balance',
      }).expect(201);
      await payOnPage(asked.body.checkoutUrl as string, TEST_CARDS.succeeds);
      await w.stripe.settled();
    } finally {
      w.stripe.setDuplicateRate(0);
    }
    const completed = w.stripe.events.filter(
      (e) =>
        e.type === 'checkout.session.completed' &&
        (e.data.object as { metadata: { jobId: string } }).metadata.jobId === jobId,
    );
    expect(completed).toHaveLength(1);
    const deliveries = w.stripe.deliveriesOf(completed[0]!.id);
    expect(deliveries.map((d) => d.attempts.at(-1)!.status)).toEqual([200, 200]);
    expect(JSON.parse(deliveries[1]!.attempts.at(-1)!.body!)).toEqual({
      received: true,
      outcome: 'duplicate',
    });
    expect(await paymentsOf(jobId)).toMatchObject([{ status: 'succeeded', amount_minor: 30_000 }]);
    expect(await getJob(jobId)).toMatchObject({ stage: 'closed', amountDueMinor: 0 });
    const invoices = await ds().query('SELECT id FROM invoices WHERE job_id = $1', [jobId]);
    expect(invoices).toHaveLength(1);
  });

  it('leaves the job unpaid with the reason when the card is declined; another card then pays', async () => {
    const { jobId } = await jobAt('handover', 21_000);
    const asked = await request(owner, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(201);
    const declined = await payOnPage(asked.body.checkoutUrl as string, TEST_CARDS.declined);
    expect(declined.status).toBe(402);
    expect(await declined.text()).toContain('Your card was declined.');
    await w.stripe.settled();
    const [payment] = await paymentsOf(jobId);
    expect(payment).toMatchObject({ status: 'failed' });
    expect(payment!.failure_reason).toMatch(/declined.*card_declined/);
    expect(await getJob(jobId)).toMatchObject({ stage: 'handover', amountDueMinor: 21_000 });

    // Extra authentication first, then approved on the second page: the same link pays.
    const first = await payOnPage(asked.body.checkoutUrl as string, TEST_CARDS.authenticate);
    expect(first.headers.get('location')).toMatch(/\/approve$/);
    const approved = await fetch(`${w.stripe.url}${first.headers.get('location')}`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: 'decision=approve',
    });
    expect(approved.status).toBe(303);
    await w.stripe.settled();
    expect(await paymentsOf(jobId)).toMatchObject([{ status: 'succeeded', failure_reason: null }]);
    expect(await getJob(jobId)).toMatchObject({ stage: 'closed', amountDueMinor: 0 });
  });

  it('makes one Checkout Session for a payment request retried after a lost answer', async () => {
    const { jobId } = await jobAt('finish', 40_000);
    // The provider's answer is lost once: the SDK retries with the same Idempotency-Key.
    const opId = randomUUID();
    w.stripe.dropResponses(1);
    const first = await request(owner, jobId, { id: randomUUID(), opId, kind: 'balance' }).expect(
      201,
    );
    expect(sessionsFor(opId)).toHaveLength(1);
    // Paid or turned back, the customer lands on our page for this job, never the sign-in.
    expect(sessionsFor(opId)[0]).toMatchObject({
      success_url: expect.stringMatching(new RegExp(`/paid\\?job=${jobId}$`)) as unknown,
      cancel_url: expect.stringMatching(new RegExp(`/paid\\?job=${jobId}&cancelled=1$`)) as unknown,
    });
    expect(w.stripe.requests.filter((r) => r.idempotencyKey === opId)).toHaveLength(2);
    // Our answer is lost: the device sends the same mutation again (another device: another id).
    const again = await request(owner, jobId, { id: randomUUID(), opId, kind: 'balance' }).expect(
      201,
    );
    expect(again.body.payment.id).toBe(first.body.payment.id);
    expect(again.body.checkoutUrl).toBe(first.body.checkoutUrl);
    expect(sessionsFor(opId)).toHaveLength(1);

    // Every answer of the provider is lost, so our command fails and nothing is recorded;
    // the retry gets the session the provider made the first time.
    const lost = randomUUID();
    w.stripe.dropResponses(2);
    const failed = await request(owner, jobId, {
      id: randomUUID(),
      opId: lost,
      kind: 'deposit',
      amountMinor: 8_000,
    });
    expect(failed.status).toBe(502);
    expect(failed.body.code).toBe('payment-provider-unreachable');
    expect(await ds().query('SELECT id FROM payments WHERE op_id = $1', [lost])).toHaveLength(0);
    const retried = await request(owner, jobId, {
      id: randomUUID(),
      opId: lost,
      kind: 'deposit',
      amountMinor: 8_000,
    }).expect(201);
    expect(sessionsFor(lost)).toHaveLength(1);
    expect(retried.body.payment.providerRef).toBe(sessionsFor(lost)[0]!.id);

    // Through the sync push, the same mutation twice is one payment.
    const clientId = randomUUID();
    const viaSync = randomUUID();
    const push = (ids: number[]) =>
      http(w.app)
        .post('/api/sync/push')
        .auth(owner.accessToken, bearer)
        .send({
          clientId,
          mutations: ids.map((id) => ({
            id,
            name: 'payment.request',
            args: { id: randomUUID(), opId: viaSync, jobId, kind: 'deposit', amountMinor: 1_000 },
            createdAt: new Date().toISOString(),
          })),
        })
        .expect(200);
    const pushed = await push([1, 2]);
    const results = pushed.body.results as { status: string }[];
    expect(results.map((r) => r.status)).toEqual(['applied', 'applied']);
    expect(sessionsFor(viaSync)).toHaveLength(1);
    expect(await ds().query('SELECT id FROM payments WHERE op_id = $1', [viaSync])).toHaveLength(1);
  });

  it('a card payment asked for offline reaches the server once, however often the push is retried, and its link syncs back', async () => {
    const { jobId } = await jobAt('handover', 30_000);
    // Queued on the phone without a signal: one mutation, its opId made once on the device.
    const clientId = randomUUID();
    const opId = randomUUID();
    const queued = {
      id: 1,
      name: 'payment.request',
      args: { id: randomUUID(), opId, jobId, kind: 'balance' },
      createdAt: new Date().toISOString(),
    };
    const push = () =>
      http(w.app)
        .post('/api/sync/push')
        .auth(owner.accessToken, bearer)
        .send({ clientId, mutations: [queued] })
        .expect(200);
    expect((await push()).body.results).toEqual([{ id: 1, status: 'applied' }]);
    // The answer was lost: the phone sends the same outbox again.
    expect((await push()).body.results).toEqual([{ id: 1, status: 'skipped' }]);
    expect(sessionsFor(opId)).toHaveLength(1);
    expect((await paymentsOf(jobId)).map((p) => [p.kind, p.status, p.amount_minor])).toEqual([
      ['balance', 'pending', 30_000],
    ]);
    // The pull brings the pending card payment with the link the phone draws as a QR code.
    const pulled = await http(w.app)
      .get('/api/sync/pull')
      .query({ clientId, cursor: 0 })
      .auth(owner.accessToken, bearer)
      .expect(200);
    expect(pulled.body.lastMutationId).toBe(1);
    const rows = (pulled.body.changes.payments ?? []) as {
      opId: string;
      method: string;
      status: string;
      checkoutUrl: string | null;
    }[];
    const row = rows.find((p) => p.opId === opId);
    expect(row).toMatchObject({ method: 'card', status: 'pending' });
    expect(row!.checkoutUrl).toBe(sessionsFor(opId)[0]!.url);
  });

  it('a newer link replaces an open older one; nobody can mark a card payment paid by hand', async () => {
    const { jobId } = await jobAt('handover', 18_000);
    const first = await request(owner, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(201);
    const second = await request(owner, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(201);
    expect(w.stripe.sessions.get(first.body.payment.providerRef as string)!.status).toBe('expired');
    expect(w.stripe.sessions.get(second.body.payment.providerRef as string)!.status).toBe('open');
    expect((await fetch(first.body.checkoutUrl as string)).status).toBe(410);
    await w.stripe.settled();
    expect((await paymentsOf(jobId)).map((p) => p.status)).toEqual(['expired', 'pending']);

    const pushed = await http(w.app)
      .post('/api/sync/push')
      .auth(owner.accessToken, bearer)
      .send({
        clientId: randomUUID(),
        mutations: [
          {
            id: 1,
            name: 'payment.settle',
            args: {
              eventId: 'evt_by_hand',
              type: 'checkout.session.completed',
              object: { payment_status: 'paid', metadata: { opId: second.body.payment.opId } },
            },
            createdAt: new Date().toISOString(),
          },
        ],
      })
      .expect(200);
    expect(pushed.body.results[0]).toMatchObject({ status: 'rejected', code: 'forbidden' });
    expect((await paymentsOf(jobId)).map((p) => p.status)).toEqual(['expired', 'pending']);
  });

  it('asks at most what is due, and a deposit defaults from the quote', async () => {
    const { jobId } = await jobAt('booked', 10_000);
    const tooMuch = await request(owner, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
      amountMinor: 10_001,
    }).expect(409);
    expect(tooMuch.body.code).toBe('amount-exceeds-due');
    const noQuote = await request(owner, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'deposit',
    }).expect(400);
    expect(noQuote.body.message).toContain('amountMinor');

    // A quote accepted by the customer books a job; its deposit link takes the quote's deposit.
    const settings = (await http(w.app).get('/api/business').auth(owner.accessToken, bearer)).body
      .settings as {
      services: { id: string }[];
      sizeClasses: { id: string }[];
      conditions: { id: string }[];
    };
    const fixture = await makeJob(w.app, owner);
    const quoteId = randomUUID();
    await http(w.app)
      .post('/api/quotes')
      .auth(owner.accessToken, bearer)
      .send({
        id: quoteId,
        customerId: fixture.customerId,
        vehicleId: fixture.vehicleId,
        inputs: {
          sizeClass: settings.sizeClasses[0]!.id,
          condition: settings.conditions[0]!.id,
          serviceIds: [settings.services[0]!.id],
          chips: 2,
          addOnIds: [],
        },
      })
      .expect(201);
    const quote = await http(w.app)
      .post(`/api/quotes/${quoteId}/send`)
      .auth(owner.accessToken, bearer)
      .send({})
      .expect(200);
    const booked = randomUUID();
    await http(w.app)
      .post(`/api/quotes/${quoteId}/accept`)
      .auth(owner.accessToken, bearer)
      .send({
        jobId: booked,
        windowStart: new Date(Date.now() + 3 * 86_400_000).toISOString(),
        windowEnd: new Date(Date.now() + 3 * 86_400_000 + 7_200_000).toISOString(),
      })
      .expect(200);
    const deposit = await request(owner, booked, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'deposit',
    }).expect(201);
    expect(deposit.body.payment.amountMinor).toBe(quote.body.depositMinor);
    await payOnPage(deposit.body.checkoutUrl as string, TEST_CARDS.succeeds);
    await w.stripe.settled();
    const job = await getJob(booked);
    expect(job).toMatchObject({
      stage: 'booked',
      amountDueMinor: quote.body.totalMinor - quote.body.depositMinor,
    });
    // The invoice of a quoted job carries the quote's lines and tax.
    await moveTo(w.app, owner, booked, 'closed');
    const [invoice] = await ds().query<
      { tax_minor: number; total_minor: number; tax_label: string; lines: unknown[] }[]
    >('SELECT tax_minor, total_minor, tax_label, lines FROM invoices WHERE job_id = $1', [booked]);
    expect(invoice).toMatchObject({
      tax_minor: quote.body.taxMinor,
      total_minor: quote.body.totalMinor,
    });
    expect(invoice!.tax_label).toMatch(/^Tax 8\.00 % on the taxable total, rounded half up$/);
    expect(invoice!.lines).toHaveLength((quote.body.lines as unknown[]).length);
  });

  it('refunds part of a card payment through the provider, never more than was paid', async () => {
    const { jobId } = await jobAt('finish', 25_000);
    const asked = await request(owner, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(201);
    await payOnPage(asked.body.checkoutUrl as string, TEST_CARDS.succeeds);
    await w.stripe.settled();
    const paymentId = asked.body.payment.id as string;
    const refundId = randomUUID();
    const refund = await http(w.app)
      .post(`/api/payments/${paymentId}/refunds`)
      .auth(owner.accessToken, bearer)
      .send({ id: refundId, amountMinor: 5_000 })
      .expect(201);
    expect(refund.body).toMatchObject({
      kind: 'refund',
      method: 'card',
      status: 'succeeded',
      refundOf: paymentId,
    });
    // Retried: the same refund, not a second one.
    await http(w.app)
      .post(`/api/payments/${paymentId}/refunds`)
      .auth(owner.accessToken, bearer)
      .send({ id: refundId, amountMinor: 5_000 })
      .expect(201);
    expect(
      [...w.stripe.refunds.values()].filter((r) => r.metadata.refundId === refundId),
    ).toHaveLength(1);
    const tooMuch = await http(w.app)
      .post(`/api/payments/${paymentId}/refunds`)
      .auth(owner.accessToken, bearer)
      .send({ id: randomUUID(), amountMinor: 20_001 })
      .expect(409);
    expect(tooMuch.body.code).toBe('refund-exceeds-paid');
    await w.stripe.settled();
    expect((await getJob(jobId)).amountDueMinor).toBe(5_000);
  });

  it('numbers invoices without gaps when many jobs close at once', async () => {
    const shop = await signUpOwner(w.app, 'numbering');
    const n = 10;
    const jobs = await Promise.all(
      Array.from({ length: n }, () => makeJob(w.app, shop, { priceMinor: 12_000 })),
    );
    for (const j of jobs) await moveTo(w.app, shop, j.jobId, 'handover');
    // Half close by a stage change, half by the payment that settles them: all at once.
    const results = await Promise.all(
      jobs.map((j, i) =>
        i % 2
          ? http(w.app)
              .post(`/api/jobs/${j.jobId}/stage`)
              .auth(shop.accessToken, bearer)
              .send({ stage: 'closed' })
          : http(w.app).post(`/api/jobs/${j.jobId}/payments`).auth(shop.accessToken, bearer).send({
              id: randomUUID(),
              opId: randomUUID(),
              kind: 'balance',
              method: 'cash',
              amountMinor: 12_000,
            }),
      ),
    );
    expect(results.map((r) => r.status).sort()).toEqual([
      ...Array(n / 2).fill(200),
      ...Array(n / 2).fill(201),
    ]);
    const rows = await ds().query<{ number: number; job_id: string }[]>(
      'SELECT number, job_id FROM invoices WHERE business_id = $1 ORDER BY number',
      [shop.user.businessId],
    );
    expect(rows.map((r) => r.number)).toEqual(Array.from({ length: n }, (_, i) => i + 1));
    expect(new Set(rows.map((r) => r.job_id)).size).toBe(n);
    const [business] = await ds().query<{ next_invoice_number: number }[]>(
      'SELECT next_invoice_number FROM businesses WHERE id = $1',
      [shop.user.businessId],
    );
    expect(business!.next_invoice_number).toBe(n + 1);
    // Issuing again answers the same invoice and takes no number.
    const again = await http(w.app)
      .post('/api/invoices')
      .auth(shop.accessToken, bearer)
      .send({ id: randomUUID(), jobId: jobs[0]!.jobId })
      .expect(201);
    expect(again.body.number).toBe(rows.find((r) => r.job_id === jobs[0]!.jobId)!.number);
  });

  it('signs the customer in with an e-mailed link once; a used or expired link is 410', async () => {
    const { jobId, customerId } = await jobAt('handover', 16_000);
    const sent = await http(w.app)
      .post('/api/customer-links')
      .auth(owner.accessToken, bearer)
      .send({ customerId })
      .expect(201);
    expect(sent.body).toMatchObject({ customerId, sentTo: 'ada@customers.example' });
    const mail = await eventually(
      async () =>
        (await mailOf(w.smtp, owner.user.businessId)).find((m) =>
          (m.text ?? '').includes(sent.body.link as string),
        ),
      10_000,
      'the sign-in link e-mail',
    );
    const token = /\/c\/([A-Za-z0-9_-]+)/.exec(mail.text!)![1]!;
    // The outbox keeps the message, but not the working link once it has left.
    const kept = await eventually(async () => {
      const [row] = await ds().query<{ status: string; text: string }[]>(
        'SELECT status, text FROM outbound_mail WHERE id = $1',
        [sent.body.mailId],
      );
      return row?.status === 'sent' ? row : null;
    });
    expect(kept.text).not.toContain(token);
    const rows = await ds().query<{ token_hash: string }[]>(
      'SELECT token_hash FROM customer_links WHERE id = $1',
      [sent.body.id],
    );
    expect(rows[0]!.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(rows[0]!.token_hash).not.toContain(token);

    const session = await http(w.app).post(`/api/customer-links/${token}/redeem`).expect(200);
    expect(session.body.user).toMatchObject({
      role: 'customer',
      businessId: owner.user.businessId,
    });
    const customer = session.body as Session;
    const used = await http(w.app).post(`/api/customer-links/${token}/redeem`).expect(410);
    expect(used.body).toMatchObject({ code: 'link-not-valid' });
    expect(used.body.message).toMatch(/used/);

    // The customer sees their own job, its report, and pays the balance.
    const mine = await http(w.app).get('/api/jobs').auth(customer.accessToken, bearer).expect(200);
    expect((mine.body.items as { id: string }[]).map((j) => j.id)).toContain(jobId);
    const report = await http(w.app)
      .get(`/api/jobs/${jobId}/report.pdf`)
      .auth(customer.accessToken, bearer)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      })
      .expect(200)
      .expect('Content-Type', 'application/pdf');
    expect((report.body as Buffer).subarray(0, 5).toString()).toBe('%PDF-');
    const other = await makeJob(w.app, owner);
    await request(customer, other.jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(404);
    const pay = await request(customer, jobId, {
      id: randomUUID(),
      opId: randomUUID(),
      kind: 'balance',
    }).expect(201);
    await payOnPage(pay.body.checkoutUrl as string, TEST_CARDS.succeeds);
    await w.stripe.settled();
    expect(await getJob(jobId)).toMatchObject({ stage: 'closed' });
    const docs = await http(w.app)
      .get(`/api/jobs/${jobId}/documents`)
      .auth(customer.accessToken, bearer)
      .expect(200);
    expect(docs.body.invoice.url).toMatch(/^\/api\/invoices\/.+\/pdf$/);
    await http(w.app)
      .get(docs.body.invoice.url as string)
      .auth(customer.accessToken, bearer)
      .expect(200);

    // A second link works once too; the same customer account is used again.
    const next = await http(w.app)
      .post('/api/customer-links')
      .auth(owner.accessToken, bearer)
      .send({ customerId })
      .expect(201);
    const nextToken = String(next.body.link).split('/c/')[1]!;
    const again = await http(w.app).post(`/api/customer-links/${nextToken}/redeem`).expect(200);
    expect(again.body.user.id).toBe(session.body.user.id);

    // An expired link is refused.
    const late = await http(w.app)
      .post('/api/customer-links')
      .auth(owner.accessToken, bearer)
      .send({ customerId })
      .expect(201);
    await ds().query(
      `UPDATE customer_links SET expires_at = now() - interval '1 minute' WHERE id = $1`,
      [late.body.id],
    );
    const expired = await http(w.app)
      .post(`/api/customer-links/${String(late.body.link).split('/c/')[1]}/redeem`)
      .expect(410);
    expect(expired.body.message).toMatch(/expired/);
    await http(w.app).post('/api/customer-links/not-a-real-token/redeem').expect(410);

    // No e-mail, no link.
    const quiet = randomUUID();
    await http(w.app)
      .post('/api/customers')
      .auth(owner.accessToken, bearer)
      .send({ id: quiet, name: 'Quiet Person' })
      .expect(201);
    const noEmail = await http(w.app)
      .post('/api/customer-links')
      .auth(owner.accessToken, bearer)
      .send({ customerId: quiet })
      .expect(409);
    expect(noEmail.body.code).toBe('no-email');
  });

  it('sends the report again on the owner’s word, and documents follow the roles', async () => {
    const { jobId, customerId } = await jobAt('handover', 9_900);
    await moveTo(w.app, owner, jobId, 'closed');
    const sent = await http(w.app)
      .post(`/api/jobs/${jobId}/send-report`)
      .auth(owner.accessToken, bearer)
      .expect(202);
    expect(sent.body.queued).toHaveLength(2);
    await eventually(
      async () => {
        const rows = await ds().query<{ status: string }[]>(
          `SELECT status FROM outbound_mail WHERE subject_id = $1`,
          [jobId],
        );
        return rows.length === 4 && rows.every((r) => r.status === 'sent');
      },
      15_000,
      'four messages sent',
    );
    await http(w.app)
      .get(`/api/jobs/${jobId}/report.pdf`)
      .auth(tech.accessToken, bearer)
      .expect(200);
    const docs = await http(w.app)
      .get(`/api/jobs/${jobId}/documents`)
      .auth(tech.accessToken, bearer)
      .expect(200);
    expect(docs.body.invoice).toBeNull();
    const invoiceId = (
      await http(w.app).get(`/api/jobs/${jobId}/documents`).auth(owner.accessToken, bearer)
    ).body.invoice.id as string;
    await http(w.app)
      .get(`/api/invoices/${invoiceId}/pdf`)
      .auth(tech.accessToken, bearer)
      .expect(403);
    const pdf = await http(w.app)
      .get(`/api/invoices/${invoiceId}/pdf`)
      .auth(owner.accessToken, bearer)
      .buffer(true)
      .parse((res, cb) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => cb(null, Buffer.concat(chunks)));
      })
      .expect(200);
    // Not paid: an invoice, with what is still due; the tax included in the agreed price.
    const text = pdfText(pdf.body as Buffer);
    expect(text).toContain('Invoice no.');
    expect(text).toContain('Still to pay: $99.00');
    expect(text).toContain('Tax 8.00 % included in the agreed price');
    const [invoice] = await ds().query<{ tax_minor: number; subtotal_minor: number }[]>(
      'SELECT tax_minor, subtotal_minor FROM invoices WHERE id = $1',
      [invoiceId],
    );
    // 9 900 × 8 / 108 = 733.33…, half up: 733.
    expect(invoice).toEqual({ tax_minor: 733, subtotal_minor: 9_167 });
    void customerId;
  });

  it('puts what was recorded into the job report, in the business’s units', async () => {
    const shop = await signUpOwner(w.app, 'report-mil');
    await http(w.app)
      .patch('/api/business')
      .auth(shop.accessToken, bearer)
      .send({
        timezone: 'America/Chicago',
        settings: { units: { thickness: 'mil', temperature: 'F' } },
      })
      .expect(200);
    const { jobId } = await makeJob(w.app, shop, { bodyStyle: 'sedan' });
    await moveTo(w.app, shop, jobId, 'finish');
    const auth = (r: ReturnType<ReturnType<typeof http>['post']>) =>
      r.auth(shop.accessToken, bearer);
    await http(w.app)
      .patch(`/api/jobs/${jobId}`)
      .auth(shop.accessToken, bearer)
      .send({ conditionNotes: 'Swirls all round; a dent in the rear door, not ours.' })
      .expect(200);
    const ws = (
      await http(w.app).get(`/api/jobs/${jobId}/workspace`).auth(shop.accessToken, bearer)
    ).body as { panels: { id: string; label: string; panelKey: string }[] };
    const hood = ws.panels.find((p) => p.panelKey === 'hood')!;
    await auth(http(w.app).post(`/api/jobs/${jobId}/pins`))
      .send({
        id: randomUUID(),
        x: 0.5,
        y: 0.3,
        kind: 'dent',
        severity: 2,
        panelKey: 'hood',
        note: 'Old dent',
      })
      .expect(201);
    for (const [phase, readings] of [
      ['before', [127, 127, 127]],
      ['after', [114.3, 114.3, 114.3]],
    ] as const) {
      await auth(http(w.app).post(`/api/jobs/${jobId}/readings`))
        .send({
          id: randomUUID(),
          panelId: hood.id,
          phase,
          readings,
          unit: 'um',
          gaugeType: 'magnetic-eddy',
        })
        .expect(201);
    }
    await auth(http(w.app).post(`/api/jobs/${jobId}/passes`))
      .send({
        id: randomUUID(),
        panelId: hood.id,
        step: 'heavy-compound',
        machine: 'dual-action',
        pad: 'microfibre',
        speedSetting: '5',
        passes: 3,
        result: 'done',
      })
      .expect(201);
    const chip = randomUUID();
    await auth(http(w.app).post(`/api/jobs/${jobId}/chips`))
      .send({ id: chip, panelId: hood.id, sizeMm: 1.5, layersPlanned: 3, note: 'Stone chip' })
      .expect(201);
    await auth(http(w.app).post(`/api/chips/${chip}/layers`))
      .send({ id: randomUUID() })
      .expect(201);
    await auth(http(w.app).post('/api/timers'))
      .send({
        id: randomUUID(),
        jobId,
        kind: 'keep-dry',
        label: 'Glass coat',
        durationMs: 12 * 3_600_000,
      })
      .expect(201);
    const res = await http(w.app)
      .get(`/api/jobs/${jobId}/report.pdf`)
      .auth(shop.accessToken, bearer)
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      })
      .expect(200);
    const text = pdfText(res.body as Buffer);
    expect(text).toContain('Swirls all round; a dent in the rear door, not ours.');
    expect(text).toContain('Old dent');
    // 127 µm is 5.00 mil; 114.3 µm is 4.50 mil; 12.7 µm (0.50 mil) taken off.
    expect(text).toContain('127 µm (5.00 mil)');
    expect(text).toContain('114 µm (4.50 mil)');
    expect(text).toContain('13 µm (0.50 mil)');
    expect(text).toContain('heavy-compound');
    expect(text).toContain('dual-action, microfibre');
    expect(text).toContain('1 of 3');
    expect(text).toContain('Glass coat');
    expect(text).toMatch(/Keep the car dry and unwashed until .*(CST|CDT|AM|PM)/s);
    expect(text).toContain('Touched-up chips keep hardening');
  });

  it('delivers each queued message once, even with several senders at once', async () => {
    const outbox = w.app.get(MailOutbox);
    const shop = await signUpOwner(w.app, 'outbox-once');
    const ids = await ds().transaction(async (m) => {
      const out: string[] = [];
      for (let i = 0; i < 6; i++) {
        out.push(
          await outbox.enqueue(m, {
            businessId: shop.user.businessId,
            kind: 'test',
            to: `reader${i}@customers.example`,
            subject: `Note ${i}`,
            text: 'Plain words.',
          }),
        );
      }
      return out;
    });
    await Promise.all([outbox.deliverDue(), outbox.deliverDue(), outbox.deliverDue()]);
    const got = await eventually(async () => {
      const list = await mailOf(w.smtp, shop.user.businessId);
      return list.length >= 6 ? list : null;
    });
    // A moment more for any second copy to arrive.
    await new Promise((r) => setTimeout(r, 400));
    const again = await mailOf(w.smtp, shop.user.businessId);
    expect(again).toHaveLength(6);
    expect(new Set(got.map((m) => m.messageId)).size).toBe(6);
    const rows = await ds().query<{ status: string; attempts: number }[]>(
      'SELECT status, attempts FROM outbound_mail WHERE id = ANY($1)',
      [ids],
    );
    expect(rows.every((r) => r.status === 'sent' && r.attempts === 1)).toBe(true);
  });

  it('keeps a message while the mail server is away and sends it when it is back', async () => {
    const shop = await signUpOwner(w.app, 'outbox-later');
    const port = w.smtp.port;
    await w.smtp.stop();
    let id: string;
    try {
      id = await ds().transaction((m) =>
        w.app.get(MailOutbox).enqueue(m, {
          businessId: shop.user.businessId,
          kind: 'test',
          to: 'patient@customers.example',
          subject: 'Sent when the relay is back',
          text: 'Plain words.',
        }),
      );
      await eventually(async () => {
        const [row] = await ds().query<{ attempts: number; status: string }[]>(
          'SELECT attempts, status FROM outbound_mail WHERE id = $1',
          [id],
        );
        return row && row.attempts >= 1 && row.status === 'pending';
      });
    } finally {
      w.smtp = await new CaptureSmtp({ port, dir: w.smtp.store.dir }).start();
    }
    const [row] = await eventually(async () => {
      const rows = await ds().query<{ status: string; last_error: string | null }[]>(
        'SELECT status, last_error FROM outbound_mail WHERE id = $1',
        [id],
      );
      return rows[0]?.status === 'sent' ? rows : null;
    }, 15_000);
    expect(row!.last_error).toBeNull();
    expect(await mailOf(w.smtp, shop.user.businessId)).toHaveLength(1);
  });
});
