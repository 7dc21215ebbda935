import { CaptureSmtp } from './smtp/capture-smtp';
import { FakeStripe } from './stripe/fake-stripe';

/**
 * Starts the local stand-ins of the hosted services, for development and browser tests:
 *
 *   node server/dist/fakes/run-fakes.js
 *
 * Settings (all optional):
 *   FAKE_STRIPE_PORT=12111             the payment API and the card pages
 *   FAKE_STRIPE_PUBLIC_URL=http://127.0.0.1:12111    base of the card page links
 *   FAKE_STRIPE_WEBHOOK_URL=http://127.0.0.1:8080/api/payments/webhook
 *   FAKE_STRIPE_WEBHOOK_SECRET=whsec_panelpass_local_only   (= the server's STRIPE_WEBHOOK_SECRET)
 *   FAKE_STRIPE_DUPLICATE_RATE=0.1     chance an event is delivered a second time
 *   FAKE_STRIPE_SEED=<n>               makes the duplicates repeatable
 *   FAKE_SMTP_PORT=12525               the capturing SMTP server (= the server's MAIL_PORT)
 *   MAIL_CAPTURE_DIR=.data/mail        where captured mail is kept (= the server's)
 *   FAKES=stripe,smtp                  which to start
 *
 * Both listen on 127.0.0.1 only. Stop with Ctrl-C or SIGTERM.
 */

function num(name: string, fallback: number, min = 0, max = Number.MAX_SAFE_INTEGER): number {
  const raw = process.env[name];
  if (raw === undefined || raw === '') return fallback;
  const n = Number(raw);
  if (!Number.isFinite(n) || n < min || n > max) {
    throw new Error(`${name} must be a number from ${min} to ${max}, not "${raw}"`);
  }
  return n;
}

async function main(): Promise<void> {
  const which = (process.env.FAKES ?? 'stripe,smtp').split(',').map((s) => s.trim());
  const log = (line: string) => console.log(line);
  const stopping: (() => Promise<void>)[] = [];
  if (which.includes('stripe')) {
    const port = num('FAKE_STRIPE_PORT', 12111, 1, 65535);
    const seed = process.env.FAKE_STRIPE_SEED;
    const stripe = await new FakeStripe({
      port,
      publicUrl: process.env.FAKE_STRIPE_PUBLIC_URL || `http://127.0.0.1:${port}`,
      webhookUrl:
        process.env.FAKE_STRIPE_WEBHOOK_URL || 'http://127.0.0.1:8080/api/payments/webhook',
      webhookSecret: process.env.FAKE_STRIPE_WEBHOOK_SECRET || 'whsec_panelpass_local_only',
      duplicateRate: num('FAKE_STRIPE_DUPLICATE_RATE', 0.1, 0, 1),
      ...(seed ? { seed: num('FAKE_STRIPE_SEED', 0) } : {}),
      log,
    }).start();
    console.log(`fake Stripe on ${stripe.url} (card pages at /pay/<session>)`);
    stopping.push(() => stripe.stop());
  }
  if (which.includes('smtp')) {
    const dir = process.env.MAIL_CAPTURE_DIR || '.data/mail';
    const smtp = await new CaptureSmtp({
      port: num('FAKE_SMTP_PORT', 12525, 1, 65535),
      dir,
      log,
    }).start();
    console.log(`mail capture on smtp://127.0.0.1:${smtp.port}, kept in ${smtp.store.dir}`);
    stopping.push(() => smtp.stop());
  }
  const stop = () => {
    void Promise.all(stopping.map((s) => s())).then(() => process.exit(0));
  };
  process.once('SIGINT', stop);
  process.once('SIGTERM', stop);
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
