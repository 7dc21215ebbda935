import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nodemailer from 'nodemailer';
import { CaptureSmtp } from './capture-smtp';
import { decodeWords, parseHeaderValue } from './mime';

describe('the capturing SMTP server', () => {
  let dir: string;
  let smtp: CaptureSmtp;

  beforeEach(async () => {
    dir = await mkdtemp(join(tmpdir(), 'capture-'));
    smtp = await new CaptureSmtp({ dir }).start();
  });
  afterEach(async () => {
    await smtp.stop();
    await rm(dir, { recursive: true, force: true });
  });

  const transport = () =>
    nodemailer.createTransport({
      host: '127.0.0.1',
      port: smtp.port,
      secure: false,
      auth: { user: 'anyone', pass: 'anything' },
    });

  it('keeps what nodemailer sends: headers, text, html and attachments with name, type and size', async () => {
    const pdf = Buffer.concat([Buffer.from('%PDF-1.3\n'), Buffer.alloc(70_000, 7)]);
    await transport().sendMail({
      from: 'Tidewater Mobile Finish <shop@tidewater.example>',
      to: 'Ada Fernhill <ada@customers.example>',
      subject: 'Reçu nº 12 — Larkspur Bay ✓',
      text: 'Merci! Keep the coating dry for 24 h.',
      html: '<p>Merci! Keep the coating <b>dry</b> for 24 h.</p>',
      headers: { 'X-Panelpass-Business': '4b0c1a7e-8f6e-4c57-9d53-1f2f3a4b5c6d' },
      attachments: [
        { filename: 'reçu-12.pdf', content: pdf, contentType: 'application/pdf' },
        { filename: 'care.txt', content: 'Wash by hand.\n', contentType: 'text/plain' },
      ],
    });
    const [m] = await smtp.store.list();
    expect(m).toMatchObject({
      subject: 'Reçu nº 12 — Larkspur Bay ✓',
      to: 'Ada Fernhill <ada@customers.example>',
      envelope: { from: 'shop@tidewater.example', to: ['ada@customers.example'] },
      businessId: '4b0c1a7e-8f6e-4c57-9d53-1f2f3a4b5c6d',
      text: 'Merci! Keep the coating dry for 24 h.',
    });
    expect(m!.html).toContain('<b>dry</b>');
    expect(m!.attachments.map((a) => [a.filename, a.contentType, a.size])).toEqual([
      ['reçu-12.pdf', 'application/pdf', pdf.length],
      ['care.txt', 'text/plain', 14],
    ]);
    const back = await smtp.store.attachment(m!.id, 0);
    expect(back!.content.equals(pdf)).toBe(true);
    expect(await smtp.store.get('../../etc/passwd')).toBeNull();
  });

  it('lists newest first', async () => {
    for (const n of [1, 2, 3]) {
      await transport().sendMail({
        from: 'a@x.example',
        to: 'b@x.example',
        subject: `n${n}`,
        text: 'x',
      });
    }
    expect((await smtp.store.list()).map((m) => m.subject)).toEqual(['n3', 'n2', 'n1']);
  });
});

describe('MIME header reading', () => {
  it('decodes RFC 2047 encoded words, joining adjacent ones', () => {
    expect(decodeWords('=?UTF-8?B?w6k=?= =?UTF-8?Q?t=C3=A9?= done')).toBe('été done');
  });

  it('puts RFC 2231 continuations and charsets together', () => {
    const v = parseHeaderValue(
      `attachment; filename*0*=utf-8''r%C3%A9sum; filename*1*=%C3%A9.pdf; size=3`,
    );
    expect(v).toEqual({ value: 'attachment', params: { filename: 'résumé.pdf', size: '3' } });
    expect(parseHeaderValue('text/plain; charset="utf-8"; name="a; b.txt"').params).toEqual({
      charset: 'utf-8',
      name: 'a; b.txt',
    });
  });
});
