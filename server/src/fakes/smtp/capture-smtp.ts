import type { AddressInfo } from 'node:net';
import { SMTPServer, type SMTPServerDataStream, type SMTPServerSession } from 'smtp-server';
import { type CapturedMessage, CaptureStore } from './capture-store';

/**
 * A local SMTP server that delivers nothing: it takes every message nodemailer hands it and
 * keeps it in a CaptureStore folder for the dev inbox and the tests. Plain SMTP on loopback:
 * no STARTTLS, sign-in optional (any user name and password are taken).
 */
export interface CaptureSmtpOptions {
  /** Default 127.0.0.1. */
  host?: string;
  /** 0 (default) takes any free port. */
  port?: number;
  /** The folder messages are kept in (MAIL_CAPTURE_DIR). */
  dir: string;
  /** Largest message taken. Default 25 MB. */
  maxBytes?: number;
  log?: (line: string) => void;
}

export class CaptureSmtp {
  readonly store: CaptureStore;
  private server: SMTPServer | null = null;
  private listeners: ((m: CapturedMessage) => void)[] = [];

  constructor(private readonly opts: CaptureSmtpOptions) {
    this.store = new CaptureStore(opts.dir);
  }

  get port(): number {
    const server = this.server as unknown as { server?: { address(): AddressInfo | null } } | null;
    return server?.server?.address()?.port ?? 0;
  }

  /** Called with each message once it is stored. */
  onMessage(fn: (m: CapturedMessage) => void): () => void {
    this.listeners.push(fn);
    return () => {
      this.listeners = this.listeners.filter((l) => l !== fn);
    };
  }

  async start(): Promise<this> {
    const maxBytes = this.opts.maxBytes ?? 25 * 1024 * 1024;
    this.server = new SMTPServer({
      banner: 'Panelpass mail capture (nothing is delivered)',
      authOptional: true,
      allowInsecureAuth: true,
      disabledCommands: ['STARTTLS'],
      size: maxBytes,
      logger: false,
      onAuth: (auth, _session, callback) => callback(null, { user: auth.username ?? 'anyone' }),
      onData: (stream: SMTPServerDataStream, session: SMTPServerSession, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (c: Buffer) => chunks.push(c));
        stream.on('end', () => {
          if (stream.sizeExceeded) {
            const err = Object.assign(new Error('Message is larger than this server takes'), {
              responseCode: 552,
            });
            callback(err);
            return;
          }
          const envelope = {
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : null,
            to: session.envelope.rcptTo.map((r) => r.address),
          };
          this.store
            .save(Buffer.concat(chunks), envelope)
            .then((m) => {
              this.opts.log?.(`[mail-capture] ${m.id} to ${envelope.to.join(', ')}: ${m.subject}`);
              for (const l of this.listeners) l(m);
              callback();
            })
            .catch((e: unknown) => callback(e instanceof Error ? e : new Error(String(e))));
        });
      },
    });
    await new Promise<void>((resolve, reject) => {
      this.server!.once('error', reject);
      this.server!.listen(this.opts.port ?? 0, this.opts.host ?? '127.0.0.1', () => resolve());
    });
    return this;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }
}
