import { createHash, randomBytes } from 'node:crypto';
import { mkdir, readdir, readFile, rename, writeFile } from 'node:fs/promises';
import { join, resolve } from 'node:path';
import { parseMessage } from './mime';

/**
 * Where the capturing SMTP server keeps what it receives, and where the dev inbox reads it:
 * one folder (MAIL_CAPTURE_DIR), two files a message —
 *
 *   <id>.eml   the message exactly as it arrived
 *   <id>.json  what was read from it (CapturedMessage), written last, so a message is listed
 *              only once it is whole
 *
 * Attachments are read back from the .eml when asked for. Ids sort by arrival time. The
 * files outlive both processes; delete the folder to empty the inbox.
 */

export interface CapturedAttachment {
  index: number;
  filename: string;
  contentType: string;
  size: number;
  sha256: string;
  disposition: 'attachment' | 'inline';
}

export interface CapturedMessage {
  id: string;
  receivedAt: string;
  envelope: { from: string | null; to: string[] };
  /** The business that sent it (our X-Panelpass-Business header), if any. */
  businessId: string | null;
  messageId: string;
  subject: string;
  from: string;
  to: string;
  cc: string;
  date: string;
  headers: { name: string; value: string }[];
  text: string | null;
  html: string | null;
  attachments: CapturedAttachment[];
  size: number;
}

export const BUSINESS_HEADER = 'X-Panelpass-Business';

const ID = /^[0-9]{17}-[0-9a-f]{8}$/;

function newId(now = new Date()): string {
  const p = (n: number, w = 2) => String(n).padStart(w, '0');
  const stamp = `${now.getUTCFullYear()}${p(now.getUTCMonth() + 1)}${p(now.getUTCDate())}${p(now.getUTCHours())}${p(now.getUTCMinutes())}${p(now.getUTCSeconds())}${p(now.getUTCMilliseconds(), 3)}`;
  return `${stamp}-${randomBytes(4).toString('hex')}`;
}

export class CaptureStore {
  readonly dir: string;

  constructor(dir: string) {
    this.dir = resolve(dir);
  }

  /** Reads a message as it arrived and stores it; answers what was stored. */
  async save(raw: Buffer, envelope: CapturedMessage['envelope']): Promise<CapturedMessage> {
    await mkdir(this.dir, { recursive: true });
    const id = newId();
    const parsed = parseMessage(raw);
    const business = parsed.headers.find(
      (h) => h.name.toLowerCase() === BUSINESS_HEADER.toLowerCase(),
    );
    const message: CapturedMessage = {
      id,
      receivedAt: new Date().toISOString(),
      envelope,
      businessId: business?.value.trim() || null,
      messageId: parsed.messageId,
      subject: parsed.subject,
      from: parsed.from,
      to: parsed.to,
      cc: parsed.cc,
      date: parsed.date,
      headers: parsed.headers,
      text: parsed.text,
      html: parsed.html,
      attachments: parsed.attachments.map((a, index) => ({
        index,
        filename: a.filename,
        contentType: a.contentType,
        size: a.content.length,
        sha256: createHash('sha256').update(a.content).digest('hex'),
        disposition: a.disposition,
      })),
      size: raw.length,
    };
    await writeAtomic(join(this.dir, `${id}.eml`), raw);
    await writeAtomic(join(this.dir, `${id}.json`), JSON.stringify(message, null, 2));
    return message;
  }

  /** Every message, newest first. */
  async list(): Promise<CapturedMessage[]> {
    let names: string[];
    try {
      names = await readdir(this.dir);
    } catch {
      return [];
    }
    const ids = names
      .filter((n) => n.endsWith('.json'))
      .map((n) => n.slice(0, -5))
      .filter((id) => ID.test(id))
      .sort()
      .reverse();
    const out: CapturedMessage[] = [];
    for (const id of ids) {
      const m = await this.get(id);
      if (m) out.push(m);
    }
    return out;
  }

  async get(id: string): Promise<CapturedMessage | null> {
    if (!ID.test(id)) return null;
    try {
      return JSON.parse(await readFile(join(this.dir, `${id}.json`), 'utf8')) as CapturedMessage;
    } catch {
      return null;
    }
  }

  /** One attachment's bytes, read back from the stored message. */
  async attachment(
    id: string,
    index: number,
  ): Promise<{ filename: string; contentType: string; content: Buffer } | null> {
    if (!ID.test(id)) return null;
    let raw: Buffer;
    try {
      raw = await readFile(join(this.dir, `${id}.eml`));
    } catch {
      return null;
    }
    const a = parseMessage(raw).attachments[index];
    return a ? { filename: a.filename, contentType: a.contentType, content: a.content } : null;
  }
}

async function writeAtomic(path: string, data: Buffer | string): Promise<void> {
  const tmp = `${path}.${randomBytes(4).toString('hex')}.tmp`;
  await writeFile(tmp, data);
  await rename(tmp, path);
}
