import { type CsvCell, safeText, toCsv } from '../ledger/csv';

/** Column types whose values are ours (numbers) and never start a spreadsheet formula. */
const NUMERIC_TYPES = new Set([
  'smallint',
  'integer',
  'bigint',
  'numeric',
  'real',
  'double precision',
]);

/**
 * One table as RFC 4180 CSV: a header row of column names, then each row's values as
 * PostgreSQL writes them as text. An empty field is a value of none (NULL). Text that a
 * spreadsheet would run as a formula gets a leading apostrophe (see safeText); numbers never
 * change.
 */
export function tableCsv(
  columns: readonly { name: string; type: string }[],
  rows: readonly (readonly (string | null)[])[],
): string {
  const cells = rows.map((row) =>
    row.map((v, i): CsvCell => (NUMERIC_TYPES.has(columns[i]?.type ?? '') ? v : safeText(v))),
  );
  return toCsv(
    columns.map((c) => c.name),
    cells,
  );
}

/**
 * The download's name, made here and never from what a client sent: the business's name in
 * lower-case ASCII letters and digits joined by dashes (at most 40 characters), and the day.
 * `Shine & Co. Ōsaka` on 2026-03-04 → `panelpass-shine-co-osaka-2026-03-04.json`.
 */
export function exportFileName(businessName: string, at: Date, ext: 'json' | 'zip'): string {
  const slug = businessName
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/, '');
  const day = at.toISOString().slice(0, 10);
  return `panelpass-${slug || 'business'}-${day}.${ext}`;
}

/** What the owner is told about images: their bytes are not in the export. */
export const IMAGES_NOTE =
  'Photos and signature images are listed in the table "blobs" by their SHA-256 (with type and size) ' +
  'and referred to by that hash from "photos" and "signatures"; their bytes are not in this export. ' +
  'While the business exists, each can be downloaded with GET /api/blobs/<sha256>. ' +
  'Deleting the business deletes them too.';

/** README.txt of the CSV zip. */
export function csvReadme(manifest: {
  exportedAt: string;
  schemaVersion: string;
  business: { id: string; name: string };
  counts: Record<string, number>;
  omittedColumns: Record<string, string[]>;
}): string {
  const lines = [
    `Panelpass: everything of "${manifest.business.name}" (${manifest.business.id})`,
    `Exported ${manifest.exportedAt}, database version ${manifest.schemaVersion}.`,
    '',
    'One CSV file per table (RFC 4180: comma-separated, fields with a comma, quote or line',
    'break in double quotes, a quote inside doubled, lines ended by CRLF, UTF-8, a header row',
    'of column names). Values are written as the database writes them as text: times in',
    'UTC as 2026-03-04 10:00:00+00, amounts in minor units (cents), JSON columns as JSON.',
    'An empty field means no value. Text that a spreadsheet would run as a formula',
    "(starting with = + - @, a tab or CR) starts with an apostrophe (') added here.",
    'manifest.json has the same counts; the JSON export holds the same rows exactly.',
    '',
    'Rows per table:',
    ...Object.entries(manifest.counts).map(([t, n]) => `  ${t}.csv  ${n}`),
    '',
    'Left out, as secrets (password hashes, hashes of sign-in links and invitations):',
    ...Object.entries(manifest.omittedColumns).map(([t, cols]) => `  ${t}: ${cols.join(', ')}`),
    '',
    IMAGES_NOTE,
    '',
  ];
  return lines.join('\r\n');
}
