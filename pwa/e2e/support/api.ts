import { deflateSync } from 'node:zlib';
import { baseUrl } from './browser';
import type { Credentials } from './signIn';

/** The demo business's helper (role `tech`), as `scripts/start` loads it. */
export const demoHelper: Credentials = {
  email: 'helper@heronwake.example',
  password: 'detail-demo-1',
};

export interface ApiSession {
  accessToken: string;
  user: { id: string; businessId: string; role: 'owner' | 'tech' };
}

/** A call to our own server's API, as the test (not the page) makes it. Fails in words. */
export async function api<T>(
  path: string,
  init: { method?: string; token?: string; body?: unknown } = {},
): Promise<T> {
  const res = await fetch(baseUrl + path, {
    method: init.method ?? 'GET',
    headers: {
      'content-type': 'application/json',
      ...(init.token ? { authorization: `Bearer ${init.token}` } : {}),
    },
    body: init.body === undefined ? undefined : JSON.stringify(init.body),
  });
  if (!res.ok) {
    throw new Error(`${init.method ?? 'GET'} ${path}: ${res.status} ${await res.text()}`);
  }
  return (res.status === 204 ? null : await res.json()) as T;
}

/** Signs in through the API (POST /api/auth/sign-in), for checking what the server holds. */
export function apiSignIn({ email, password }: Credentials): Promise<ApiSession> {
  return api<ApiSession>('/api/auth/sign-in', { method: 'POST', body: { email, password } });
}

export interface ApiJob {
  id: string;
  stage: string;
  address: string | null;
  assignedTechId: string | null;
  conditionNotes: string;
}

/** The demo job at this address (the demo week has one visit per address). */
export async function jobAt(token: string, address: string): Promise<ApiJob> {
  const page = await api<{ items: ApiJob[] }>('/api/jobs?limit=100', { token });
  const job = page.items.find((j) => j.address === address);
  if (!job) throw new Error(`No demo job at ${address}: is the database freshly seeded?`);
  return job;
}

export interface AuditEntry {
  command: string;
  subjectId: string | null;
  via: string;
  args: Record<string, unknown>;
}

/** Every audit entry of the business (newest first), all pages. */
export async function allAudit(token: string): Promise<AuditEntry[]> {
  const out: AuditEntry[] = [];
  for (let offset = 0; ; offset += 200) {
    const page = await api<{ items: AuditEntry[]; total: number }>(
      `/api/audit?limit=200&offset=${offset}`,
      { token },
    );
    out.push(...page.items);
    if (offset + 200 >= page.total) return out;
  }
}

/** The audit entries about one record (the id its command named). */
export async function auditOf(token: string, subjectId: string): Promise<AuditEntry[]> {
  const page = await api<{ items: AuditEntry[] }>(`/api/audit?limit=200&subjectId=${subjectId}`, {
    token,
  });
  return page.items;
}

/** How many times each command name occurs, for comparing two lists of mutations. */
export function countByName(names: readonly string[]): Record<string, number> {
  const out: Record<string, number> = {};
  for (const n of [...names].sort()) out[n] = (out[n] ?? 0) + 1;
  return out;
}

/* A small PNG, made here: what a camera picture stands in for (no file from anywhere else). */

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

function crc32(bytes: Buffer): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const length = Buffer.alloc(4);
  length.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(body));
  return Buffer.concat([length, body, crc]);
}

/**
 * An RGB PNG of `width`×`height` with a diagonal band, so it is not one flat colour. Each
 * `seed` gives different pixels (a different SHA-256), so two photos are two images.
 */
export function makePng(width: number, height: number, seed = 0): Buffer {
  const rows: Buffer[] = [];
  for (let y = 0; y < height; y++) {
    const row = Buffer.alloc(1 + width * 3);
    for (let x = 0; x < width; x++) {
      const band = Math.abs(x - y) < width / 8;
      row[1 + x * 3] = band ? 220 : (40 + seed * 37) % 256;
      row[2 + x * 3] = band ? 180 : (90 + x) % 256;
      row[3 + x * 3] = band ? 30 : (140 + y) % 256;
    }
    rows.push(row);
  }
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header[8] = 8; // bit depth
  header[9] = 2; // RGB
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', header),
    chunk('IDAT', deflateSync(Buffer.concat(rows))),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}
