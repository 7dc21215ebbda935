/**
 * A small MIME reader for the capturing SMTP server: enough of RFC 2045–2047 and 2231 to read
 * what nodemailer (or any ordinary mail program) writes — headers with encoded words,
 * multipart bodies, base64 and quoted-printable parts, file names in any charset.
 */

export interface MimeHeader {
  name: string;
  /** Unfolded, with encoded words decoded. */
  value: string;
}

export interface MimeAttachment {
  filename: string;
  contentType: string;
  disposition: 'attachment' | 'inline';
  contentId: string | null;
  content: Buffer;
}

export interface ParsedMessage {
  headers: MimeHeader[];
  subject: string;
  from: string;
  to: string;
  cc: string;
  date: string;
  messageId: string;
  text: string | null;
  html: string | null;
  attachments: MimeAttachment[];
}

interface Part {
  headers: MimeHeader[];
  body: Buffer;
}

/** Splits the head from the body at the first empty line. */
function splitPart(raw: Buffer): Part {
  let cut = -1;
  let skip = 0;
  for (let i = 0; i < raw.length - 1; i++) {
    if (raw[i] === 0x0a && raw[i + 1] === 0x0a) {
      cut = i;
      skip = 2;
      break;
    }
    if (raw[i] === 0x0d && raw[i + 1] === 0x0a && raw[i + 2] === 0x0d && raw[i + 3] === 0x0a) {
      cut = i;
      skip = 4;
      break;
    }
  }
  if (cut < 0) return { headers: parseHeaders(raw.toString('latin1')), body: Buffer.alloc(0) };
  return {
    headers: parseHeaders(raw.subarray(0, cut).toString('latin1')),
    body: raw.subarray(cut + skip),
  };
}

function parseHeaders(block: string): MimeHeader[] {
  const lines = block.split(/\r?\n/);
  const unfolded: string[] = [];
  for (const line of lines) {
    if (/^[ \t]/.test(line) && unfolded.length) unfolded[unfolded.length - 1] += line;
    else if (line) unfolded.push(line);
  }
  return unfolded.flatMap((line) => {
    const colon = line.indexOf(':');
    if (colon <= 0) return [];
    // Header bytes are kept as latin1 above; raw UTF-8 (RFC 6532) is recovered here.
    const raw = Buffer.from(line.slice(colon + 1).trim(), 'latin1').toString('utf8');
    return [{ name: line.slice(0, colon).trim(), value: decodeWords(raw) }];
  });
}

function charsetDecode(bytes: Buffer, charset: string): string {
  try {
    return new TextDecoder(charset.trim().toLowerCase() || 'utf-8').decode(bytes);
  } catch {
    return bytes.toString('utf8');
  }
}

/** RFC 2047: `=?utf-8?B?…?=` and `=?utf-8?Q?…?=`; whitespace between two encoded words goes. */
export function decodeWords(value: string): string {
  const word = /=\?([^?]+)\?([bBqQ])\?([^?]*)\?=/g;
  const joined = value.replace(/(=\?[^?]+\?[bBqQ]\?[^?]*\?=)\s+(?==\?)/g, '$1');
  return joined.replace(word, (_m, charset: string, enc: string, text: string) => {
    const cs = charset.split('*')[0]!;
    if (enc.toUpperCase() === 'B') return charsetDecode(Buffer.from(text, 'base64'), cs);
    const bytes = qpBytes(text.replace(/_/g, ' '));
    return charsetDecode(bytes, cs);
  });
}

function qpBytes(text: string): Buffer {
  const out: number[] = [];
  for (let i = 0; i < text.length; i++) {
    const c = text[i]!;
    if (c === '=' && /^[0-9A-Fa-f]{2}$/.test(text.slice(i + 1, i + 3))) {
      out.push(parseInt(text.slice(i + 1, i + 3), 16));
      i += 2;
    } else {
      out.push(text.charCodeAt(i) & 0xff);
    }
  }
  return Buffer.from(out);
}

/** Quoted-printable body: soft line breaks removed, `=XX` decoded. */
export function decodeQuotedPrintable(body: Buffer): Buffer {
  const text = body.toString('latin1').replace(/=\r?\n/g, '');
  return qpBytes(text);
}

export interface HeaderValue {
  value: string;
  params: Record<string, string>;
}

/**
 * `type/subtype; name="a b"; filename*=utf-8''%C3%A9.pdf` → value and parameters, with RFC
 * 2231 continuations (`name*0*`, `name*1*`) and charsets put together.
 */
export function parseHeaderValue(input: string): HeaderValue {
  const parts: string[] = [];
  let cur = '';
  let quoted = false;
  for (let i = 0; i < input.length; i++) {
    const c = input[i]!;
    if (c === '"') quoted = !quoted;
    if (c === '\\' && quoted) {
      cur += c + (input[i + 1] ?? '');
      i++;
      continue;
    }
    if (c === ';' && !quoted) {
      parts.push(cur);
      cur = '';
      continue;
    }
    cur += c;
  }
  parts.push(cur);
  const value = (parts.shift() ?? '').trim();
  const pieces = new Map<string, { index: number; encoded: boolean; text: string }[]>();
  for (const p of parts) {
    const eq = p.indexOf('=');
    if (eq < 0) continue;
    const key = p.slice(0, eq).trim().toLowerCase();
    let val = p.slice(eq + 1).trim();
    if (val.startsWith('"') && val.endsWith('"')) {
      val = val.slice(1, -1).replace(/\\(.)/g, '$1');
    }
    const m = /^([^*]+)(?:\*(\d+))?(\*)?$/.exec(key);
    if (!m) continue;
    const name = m[1]!;
    const list = pieces.get(name) ?? [];
    list.push({ index: m[2] ? Number(m[2]) : 0, encoded: !!m[3], text: val });
    pieces.set(name, list);
  }
  const params: Record<string, string> = {};
  for (const [name, list] of pieces) {
    list.sort((a, b) => a.index - b.index);
    let charset = 'utf-8';
    const bytes: Buffer[] = [];
    list.forEach((piece, i) => {
      let text = piece.text;
      if (piece.encoded) {
        if (i === 0) {
          const m = /^([^']*)'[^']*'(.*)$/.exec(text);
          if (m) {
            charset = m[1] || 'utf-8';
            text = m[2]!;
          }
        }
        bytes.push(
          Buffer.from(
            text.replace(/%([0-9A-Fa-f]{2})/g, (_x, h: string) =>
              String.fromCharCode(parseInt(h, 16)),
            ),
            'latin1',
          ),
        );
      } else {
        bytes.push(Buffer.from(text, 'utf8'));
      }
    });
    const anyEncoded = list.some((p) => p.encoded);
    const joined = Buffer.concat(bytes);
    params[name] = anyEncoded
      ? charsetDecode(joined, charset)
      : decodeWords(joined.toString('utf8'));
  }
  return { value, params };
}

const header = (headers: MimeHeader[], name: string): string =>
  headers.find((h) => h.name.toLowerCase() === name.toLowerCase())?.value ?? '';

function decodeBody(part: Part): Buffer {
  const enc = header(part.headers, 'Content-Transfer-Encoding').trim().toLowerCase();
  if (enc === 'base64')
    return Buffer.from(part.body.toString('latin1').replace(/[^A-Za-z0-9+/=]/g, ''), 'base64');
  if (enc === 'quoted-printable') return decodeQuotedPrintable(part.body);
  return part.body;
}

/** The body parts of a multipart body, between its boundary lines. */
function splitMultipart(body: Buffer, boundary: string): Buffer[] {
  const text = body.toString('latin1');
  const delimiter = `--${boundary}`;
  const lines = text.split(/\r?\n/);
  const parts: string[][] = [];
  let current: string[] | null = null;
  for (const line of lines) {
    if (line.trimEnd() === `${delimiter}--`) {
      if (current) parts.push(current);
      current = null;
      break;
    }
    if (line.trimEnd() === delimiter) {
      if (current) parts.push(current);
      current = [];
      continue;
    }
    if (current) current.push(line);
  }
  if (current) parts.push(current);
  return parts.map((p) => Buffer.from(p.join('\r\n'), 'latin1'));
}

/** Reads one message. */
export function parseMessage(raw: Buffer): ParsedMessage {
  const top = splitPart(raw);
  const out: ParsedMessage = {
    headers: top.headers,
    subject: header(top.headers, 'Subject'),
    from: header(top.headers, 'From'),
    to: header(top.headers, 'To'),
    cc: header(top.headers, 'Cc'),
    date: header(top.headers, 'Date'),
    messageId: header(top.headers, 'Message-ID'),
    text: null,
    html: null,
    attachments: [],
  };
  walk(top, out, 0);
  return out;
}

function walk(part: Part, out: ParsedMessage, depth: number): void {
  const type = parseHeaderValue(header(part.headers, 'Content-Type') || 'text/plain');
  const mime = type.value.toLowerCase();
  if (mime.startsWith('multipart/') && type.params.boundary && depth < 20) {
    for (const child of splitMultipart(part.body, type.params.boundary)) {
      walk(splitPart(child), out, depth + 1);
    }
    return;
  }
  const disposition = parseHeaderValue(header(part.headers, 'Content-Disposition'));
  const filename = disposition.params.filename ?? type.params.name ?? '';
  const content = decodeBody(part);
  const isAttachment = disposition.value.toLowerCase() === 'attachment' || !!filename;
  if (!isAttachment && mime === 'text/plain' && out.text === null) {
    out.text = charsetDecode(content, type.params.charset ?? 'utf-8');
    return;
  }
  if (!isAttachment && mime === 'text/html' && out.html === null) {
    out.html = charsetDecode(content, type.params.charset ?? 'utf-8');
    return;
  }
  const cid = header(part.headers, 'Content-ID').replace(/^<|>$/g, '');
  out.attachments.push({
    filename: filename || `part-${out.attachments.length + 1}`,
    contentType: mime,
    disposition: disposition.value.toLowerCase() === 'inline' ? 'inline' : 'attachment',
    contentId: cid || null,
    content,
  });
}
