// Invented data for the speed benchmarks (scripts/bench/api, scripts/bench/scale), written
// straight into the real tables with INSERT … SELECT over generate_series: a solo detailer's
// customers, vehicles, Shelf products, and per working day a few jobs with the records a job
// gathers (quote and lines, panels, checklist, film readings, correction passes, pins, photo
// records, chips and layers, solvents, masking, timers, climate, signatures, payments, an
// invoice, stock used). Every foreign key, unique key and NOT NULL holds; `version` comes from
// the `sync_version` sequence through the tables' own trigger, and rows go in parents first, so
// a pull sees them as it would see the app's writes. Ids are md5-derived UUIDs, so a second
// run over the same days adds nothing twice (ON CONFLICT DO NOTHING).
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);
const shared = require('../../shared/dist/index.js');

/** Records per job: `full` is a paint correction as the app records it; `lean` a lighter one. */
export const DETAIL = {
  full: {
    panels: 13,
    readingPhases: 2,
    passesPerPanel: 2,
    checklist: 12,
    pins: 3,
    photos: 8,
    chips: 1,
    layersPerChip: 3,
    solvents: 2,
    masking: 4,
    timers: 4,
    climate: 2,
    signatures: 2,
    quoteLines: 3,
    stockUses: 3,
  },
  lean: {
    panels: 4,
    readingPhases: 1,
    passesPerPanel: 1,
    checklist: 3,
    pins: 1,
    photos: 2,
    chips: 1,
    layersPerChip: 1,
    solvents: 1,
    masking: 1,
    timers: 2,
    climate: 1,
    signatures: 1,
    quoteLines: 1,
    stockUses: 1,
  },
};

const FIRST = [
  'Avery',
  'Jordan',
  'Morgan',
  'Riley',
  'Quinn',
  'Rowan',
  'Sasha',
  'Tobin',
  'Wren',
  'Ellis',
  'Noor',
  'Idris',
];
const LAST = [
  'Ashdown',
  'Brightwell',
  'Carrow',
  'Dunmere',
  'Fenwick',
  'Galloway',
  'Hartsel',
  'Inglen',
  'Marrow',
  'Pellard',
  'Quillon',
  'Stavely',
];
// Invented makes and models: generated data names no real brand.
const MAKES = ['Corvane', 'Altessa', 'Norrik', 'Valdo', 'Serin', 'Mostar'];
const MODELS = ['Aster', 'Brio', 'Cadence', 'Drift', 'Ember', 'Fjord', 'Glide', 'Harbor'];
const COLOURS = ['pearl white', 'graphite', 'deep blue', 'signal red', 'silver', 'black'];
const PRODUCTS = [
  ['Cut compound C3', 'compound'],
  ['One-step polish P2', 'polish'],
  ['Finishing polish F1', 'finishing-polish'],
  ['Tar and sap solvent', 'solvent'],
  ['Trim tape 18 mm', 'tape'],
  ['Touch-up clear', 'touch-up'],
  ['Ceramic coat 9', 'protection'],
  ['Panel wipe', 'cleaner'],
  ['Microfibre cutting pad', 'pad'],
  ['Foam polishing pad', 'pad'],
  ['Inspection light', 'tool'],
  ['Iron remover', 'cleaner'],
];

const lit = (s) => `'${String(s).replace(/'/g, "''")}'`;
const textArray = (xs) => `ARRAY[${xs.map(lit).join(', ')}]::text[]`;
/** A number 0..n-1 from a text key, stable between runs. */
const pick = (key, n) => `(abs(hashtext(${key})) % ${n})`;

/** Businesses made in SQL alone (their owners have no password): the crowd around the one measured. */
export async function addBusinesses(db, count, label) {
  const { rows } = await db.query(
    `WITH b AS (
       INSERT INTO businesses (id, name)
       SELECT gen_random_uuid(), $2 || ' ' || n FROM generate_series(1, $1::int) n
       RETURNING id, name
     ), u AS (
       INSERT INTO users (business_id, email, name, role)
       SELECT id, 'owner-' || id || '@bench.invalid', 'Owner of ' || name, 'owner' FROM b
       RETURNING business_id
     )
     SELECT business_id AS id FROM u`,
    [count, label],
  );
  return rows.map((r) => r.id);
}

async function withBusinesses(db, businessIds, fn) {
  await db.query('DROP TABLE IF EXISTS gen_b');
  await db.query(
    `CREATE TEMP TABLE gen_b AS
     SELECT b.id, (SELECT u.id FROM users u WHERE u.business_id = b.id AND u.role = 'owner'
                   ORDER BY u.created_at LIMIT 1) AS uid
     FROM businesses b WHERE b.id = ANY($1::uuid[])`,
    [businessIds],
  );
  try {
    return await fn();
  } finally {
    await db.query('DROP TABLE IF EXISTS gen_b');
  }
}

/** Customers (each with one vehicle) and the Shelf's products of each business. */
export async function addPools(db, businessIds, { customers }) {
  return withBusinesses(db, businessIds, async () => {
    const k = `b.id || ':c:' || k`;
    await db.query(`
      INSERT INTO customers (id, business_id, name, email, phone, address, notes, created_at)
      SELECT md5(${k})::uuid, b.id,
        (${textArray(FIRST)})[1 + ${pick(`${k} || 'f'`, FIRST.length)}] || ' ' ||
          (${textArray(LAST)})[1 + ${pick(`${k} || 'l'`, LAST.length)}],
        'client-' || k || '@example.invalid', '+1 555 01' || lpad((k % 100)::text, 2, '0'),
        (10 + k % 890) || ' Orchard Lane', '', now() - interval '10 years'
      FROM gen_b b, generate_series(0, ${customers - 1}) k
      ON CONFLICT (id) DO NOTHING`);
    await db.query(`
      INSERT INTO vehicles (id, business_id, customer_id, make, model, year, body_style, colour, plate, created_at)
      SELECT md5(b.id || ':v:' || k)::uuid, b.id, md5(${k})::uuid,
        (${textArray(MAKES)})[1 + ${pick(`${k} || 'm'`, MAKES.length)}],
        (${textArray(MODELS)})[1 + ${pick(`${k} || 'o'`, MODELS.length)}],
        2008 + k % 17, 'sedan',
        (${textArray(COLOURS)})[1 + ${pick(`${k} || 'c'`, COLOURS.length)}],
        'PP' || lpad(k::text, 5, '0'), now() - interval '10 years'
      FROM gen_b b, generate_series(0, ${customers - 1}) k
      ON CONFLICT (id) DO NOTHING`);
    const products = PRODUCTS.map(([name, kind], i) => `(${i}, ${lit(name)}, ${lit(kind)})`);
    await db.query(`
      INSERT INTO products (id, business_id, name, kind, stock_qty, amount_per_use, unit_cost_minor, low_stock_at, created_at)
      SELECT md5(b.id || ':p:' || p.i)::uuid, b.id, p.name, p.kind, 5000, 30, 2.5, 500, now() - interval '10 years'
      FROM gen_b b, (VALUES ${products.join(', ')}) AS p(i, name, kind)
      ON CONFLICT (id) DO NOTHING`);
  });
}

/**
 * Jobs on the working days (Monday to Friday) from `fromDay` to `toDay` (YYYY-MM-DD), with
 * `jobsPerDay` each and their records (DETAIL[detail]). Days before `today` are closed and
 * paid; `today`'s jobs are one closed, one in correction, one booked; later days booked.
 * `customers` is the pool size given to addPools. Answers the rows added per table.
 */
export async function addJobs(
  db,
  businessIds,
  { fromDay, toDay, today, jobsPerDay = 3, detail = 'full', customers },
) {
  const d = DETAIL[detail];
  const panels = shared.bodyStyleTemplate('sedan').slice(0, d.panels);
  const checklist = shared.DEFAULT_CHECKLIST.slice(0, d.checklist);
  const panelValues = panels
    .map(
      (p, i) =>
        `(${i}, ${lit(p.id)}, ${lit(p.label)}, ${lit(p.band)}, ${lit(p.substrate)}, ${p.areaM2})`,
    )
    .join(', ');
  const checkValues = checklist
    .map((c, i) => `(${i}, ${lit(c.stage)}, ${lit(c.key)}, ${lit(c.label)})`)
    .join(', ');
  const counts = {};
  const run = async (table, sql) => {
    const res = await db.query(sql);
    counts[table] = (counts[table] ?? 0) + res.rowCount;
  };
  return withBusinesses(db, businessIds, async () => {
    await db.query('DROP TABLE IF EXISTS gj');
    await db.query(`
      CREATE TEMP TABLE gj AS
      SELECT x.*, md5(x.id || ':q')::uuid AS qid,
        md5(x.bid || ':c:' || x.k)::uuid AS cid, md5(x.bid || ':v:' || x.k)::uuid AS vid
      FROM (
        SELECT b.id AS bid, b.uid, day::date AS day, s AS slot,
          md5(b.id || ':job:' || day::date || ':' || s)::uuid AS id,
          ${pick(`b.id || ':' || day::date || ':' || s`, customers)} AS k,
          (day::date + time '08:00' + s * interval '3 hours 30 minutes') AT TIME ZONE 'UTC' AS ws,
          CASE WHEN day::date < ${lit(today)}::date THEN 'closed'
               WHEN day::date > ${lit(today)}::date THEN 'booked'
               ELSE (ARRAY['closed', 'correction', 'booked'])[1 + s % 3] END AS stage,
          (45000 + ${pick(`b.id || ':' || day::date || ':' || s`, 60)} * 1000) AS price
        FROM gen_b b,
          generate_series(${lit(fromDay)}::date, ${lit(toDay)}::date, interval '1 day') day,
          generate_series(0, ${jobsPerDay - 1}) s
        WHERE extract(isodow FROM day) < 6
      ) x`);
    await db.query(`CREATE INDEX ON gj (id)`);
    await db.query('ANALYZE gj');
    // Work done: closed jobs and today's job in correction.
    const worked = `j.stage IN ('closed', 'correction')`;
    const prod = (i) => `md5(j.bid || ':p:' || ${i})::uuid`;

    await run(
      'quotes',
      `INSERT INTO quotes (id, business_id, customer_id, vehicle_id, status, inputs, subtotal_minor,
         tax_minor, total_minor, deposit_minor, labour_hours, valid_until, sent_at, accepted_at,
         job_id, created_at)
       SELECT j.qid, j.bid, j.cid, j.vid, 'accepted', '{"bodyStyle": "sedan"}', j.price, 0, j.price,
         j.price / 5, 6.5, j.ws, j.ws - interval '12 days', j.ws - interval '10 days', j.id,
         j.ws - interval '12 days'
       FROM gj j ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'quote_lines',
      `INSERT INTO quote_lines (id, business_id, quote_id, position, kind, description, quantity,
         unit_price_minor, amount_minor, created_at)
       SELECT md5(j.qid || ':l:' || i)::uuid, j.bid, j.qid, i, CASE WHEN i = 0 THEN 'service' ELSE 'add-on' END,
         CASE WHEN i = 0 THEN 'Two-step paint correction' ELSE 'Add-on ' || i END, 1,
         CASE WHEN i = 0 THEN j.price - (${d.quoteLines} - 1) * 2000 ELSE 2000 END,
         CASE WHEN i = 0 THEN j.price - (${d.quoteLines} - 1) * 2000 ELSE 2000 END,
         j.ws - interval '12 days'
       FROM gj j, generate_series(0, ${d.quoteLines - 1}) i ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'jobs',
      `INSERT INTO jobs (id, business_id, customer_id, vehicle_id, quote_id, address, window_start,
         window_end, stage, condition_notes, notes, price_minor, services, created_at)
       SELECT j.id, j.bid, j.cid, j.vid, j.qid, (10 + j.k % 890) || ' Orchard Lane', j.ws,
         j.ws + interval '3 hours', j.stage, '', 'Driveway, power at the garage', j.price,
         ARRAY['paint-correction'], j.ws - interval '10 days'
       FROM gj j ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'job_panels',
      `INSERT INTO job_panels (id, business_id, job_id, panel_key, label, band, position, substrate,
         state, area_m2, created_at)
       SELECT md5(j.id || ':panel:' || p.key)::uuid, j.bid, j.id, p.key, p.label, p.band, p.i,
         p.substrate, CASE WHEN j.stage = 'closed' THEN 'done' ELSE 'todo' END, p.area,
         j.ws - interval '10 days'
       FROM gj j, (VALUES ${panelValues}) AS p(i, key, label, band, substrate, area)
       ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'checklist_items',
      `INSERT INTO checklist_items (id, business_id, job_id, stage, key, label, position, done,
         done_at, done_by, created_at)
       SELECT md5(j.id || ':check:' || c.key)::uuid, j.bid, j.id, c.stage, c.key, c.label, c.i,
         j.stage = 'closed', CASE WHEN j.stage = 'closed' THEN j.ws + interval '1 hour' END,
         CASE WHEN j.stage = 'closed' THEN j.uid END, j.ws - interval '10 days'
       FROM gj j, (VALUES ${checkValues}) AS c(i, stage, key, label) ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'damage_pins',
      `INSERT INTO damage_pins (id, business_id, job_id, number, x, y, panel_key, kind, severity, note, created_at)
       SELECT md5(j.id || ':pin:' || i)::uuid, j.bid, j.id, i, 0.1 + 0.2 * i, 0.3, ${lit(panels[0].id)},
         'scratch', 2, 'Swirl cluster', j.ws + interval '10 minutes'
       FROM gj j, generate_series(1, ${d.pins}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'film_readings',
      `INSERT INTO film_readings (id, business_id, job_id, panel_id, phase, readings_um, unit,
         gauge_type, taken_at, taken_by, created_at)
       SELECT md5(j.id || ':read:' || p.key || ':' || ph)::uuid, j.bid, j.id,
         md5(j.id || ':panel:' || p.key)::uuid, (ARRAY['before', 'after'])[ph],
         ARRAY[118.5, 121.0, 119.8, 124.2, 120.6]::float8[], 'um', 'magnetic',
         j.ws + ph * interval '90 minutes', j.uid, j.ws + ph * interval '90 minutes'
       FROM gj j, (VALUES ${panelValues}) AS p(i, key, label, band, substrate, area),
         generate_series(1, ${d.readingPhases}) ph
       WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'correction_passes',
      `INSERT INTO correction_passes (id, business_id, job_id, panel_id, step, machine, pad,
         product_id, speed_setting, passes, result, note, logged_at, logged_by, created_at)
       SELECT md5(j.id || ':pass:' || p.key || ':' || s)::uuid, j.bid, j.id,
         md5(j.id || ':panel:' || p.key)::uuid, (ARRAY['heavy-compound', 'polish'])[1 + (s - 1) % 2],
         'dual-action', CASE WHEN s = 1 THEN 'microfibre cutting' ELSE 'foam polishing' END,
         ${prod('(s - 1) % 2')}, '5', 2, 'done', '', j.ws + interval '1 hour' + p.i * interval '5 minutes',
         j.uid, j.ws + interval '1 hour'
       FROM gj j, (VALUES ${panelValues}) AS p(i, key, label, band, substrate, area),
         generate_series(1, ${d.passesPerPanel}) s
       WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'chips',
      `INSERT INTO chips (id, business_id, job_id, number, size_mm, layers_planned, note, created_at)
       SELECT md5(j.id || ':chip:' || i)::uuid, j.bid, j.id, i, 2.5, ${d.layersPerChip}, '', j.ws + interval '20 minutes'
       FROM gj j, generate_series(1, ${d.chips}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'chip_layers',
      `INSERT INTO chip_layers (id, business_id, job_id, chip_id, applied_at, product_id, applied_by, created_at)
       SELECT md5(j.id || ':layer:' || i || ':' || l)::uuid, j.bid, j.id, md5(j.id || ':chip:' || i)::uuid,
         j.ws + l * interval '20 minutes', ${prod(5)}, j.uid, j.ws + l * interval '20 minutes'
       FROM gj j, generate_series(1, ${d.chips}) i, generate_series(1, ${d.layersPerChip}) l
       WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'solvent_applications',
      `INSERT INTO solvent_applications (id, business_id, job_id, panel_id, product_id, surface_temp_c,
         in_sun, applied_at, flush_by, flushed_at, applied_by, created_at)
       SELECT md5(j.id || ':solvent:' || i)::uuid, j.bid, j.id, md5(j.id || ':panel:' || ${lit(panels[0].id)})::uuid,
         ${prod(3)}, 19.5, false, j.ws + i * interval '15 minutes', j.ws + i * interval '15 minutes' + interval '5 minutes',
         j.ws + i * interval '15 minutes' + interval '4 minutes', j.uid, j.ws
       FROM gj j, generate_series(1, ${d.solvents}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'masking_items',
      `INSERT INTO masking_items (id, business_id, job_id, what, product_id, applied_at, remove_by, removed_at, created_at)
       SELECT md5(j.id || ':mask:' || i)::uuid, j.bid, j.id, 'Trim piece ' || i, ${prod(4)},
         j.ws + interval '30 minutes', j.ws + interval '8 hours',
         CASE WHEN j.stage = 'closed' THEN j.ws + interval '2 hours 40 minutes' END, j.ws
       FROM gj j, generate_series(1, ${d.masking}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'timers',
      `INSERT INTO timers (id, business_id, job_id, kind, label, started_at, ends_at, acknowledged_at,
         started_by, created_at)
       SELECT md5(j.id || ':timer:' || i)::uuid, j.bid, j.id,
         (ARRAY['cure', 'flush', 'dwell', 'keep-dry'])[1 + (i - 1) % 4], 'Timer ' || i,
         j.ws + i * interval '25 minutes', j.ws + i * interval '25 minutes' + interval '20 minutes',
         CASE WHEN j.stage = 'closed' THEN j.ws + i * interval '25 minutes' + interval '20 minutes' END,
         j.uid, j.ws + i * interval '25 minutes'
       FROM gj j, generate_series(1, ${d.timers}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'climate_readings',
      `INSERT INTO climate_readings (id, business_id, job_id, air_c, rh_pct, surface_c, taken_at, taken_by, created_at)
       SELECT md5(j.id || ':climate:' || i)::uuid, j.bid, j.id, 17.5 + i, 55.0, 19.0,
         j.ws + i * interval '1 hour', j.uid, j.ws + i * interval '1 hour'
       FROM gj j, generate_series(1, ${d.climate}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'photos',
      `INSERT INTO photos (id, business_id, job_id, vehicle_id, kind, sha256, mime, width, height, bytes,
         caption, taken_at, created_at)
       SELECT md5(j.id || ':photo:' || i)::uuid, j.bid, j.id, j.vid,
         CASE WHEN i % 2 = 1 THEN 'before' ELSE 'after' END,
         encode(sha256(convert_to(j.id || ':photo:' || i, 'UTF8')), 'hex'), 'image/jpeg', 1600, 1200,
         350000, '', j.ws + i * interval '10 minutes', j.ws + i * interval '10 minutes'
       FROM gj j, generate_series(1, ${d.photos}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'signatures',
      `INSERT INTO signatures (id, business_id, job_id, kind, signer_name, image_sha256, record_hash,
         record, signed_at, created_at)
       SELECT md5(j.id || ':sig:' || i)::uuid, j.bid, j.id, (ARRAY['condition', 'acceptance'])[1 + (i - 1) % 2],
         'The customer', encode(sha256(convert_to(j.id || ':sigimg:' || i, 'UTF8')), 'hex'),
         encode(sha256(convert_to(j.id || ':rec:' || i, 'UTF8')), 'hex'),
         jsonb_build_object('jobId', j.id, 'kind', i), j.ws + i * interval '2 hours', j.ws + i * interval '2 hours'
       FROM gj j, generate_series(1, ${d.signatures}) i WHERE ${worked} ON CONFLICT (id) DO NOTHING`,
    );
    // A deposit when the quote was accepted; the balance at handover; now and then a refund.
    await run(
      'payments',
      `INSERT INTO payments (id, business_id, job_id, quote_id, kind, method, amount_minor, status, op_id,
         paid_at, recorded_by, refund_of, created_at)
       SELECT md5(j.id || ':pay:' || x.n)::uuid, j.bid, j.id, j.qid, x.kind, x.method, x.amount, 'succeeded',
         md5(j.id || ':op:' || x.n)::uuid, x.at, j.uid,
         CASE WHEN x.kind = 'refund' THEN md5(j.id || ':pay:1')::uuid END, x.at
       FROM gj j CROSS JOIN LATERAL (VALUES
         (0, 'deposit', 'card', j.price / 5, j.ws - interval '10 days', true),
         (1, 'balance', 'cash', j.price - j.price / 5, j.ws + interval '3 hours', j.stage = 'closed'),
         (2, 'refund', 'cash', 2500, j.ws + interval '4 hours', j.stage = 'closed' AND ${pick(`j.id::text`, 40)} = 0)
       ) AS x(n, kind, method, amount, at, made)
       WHERE x.made ORDER BY x.at ON CONFLICT (id) DO NOTHING`,
    );
    await run(
      'invoices',
      `INSERT INTO invoices (id, business_id, job_id, number, issued_at, subtotal_minor, tax_minor,
         total_minor, lines, tax_label, created_at)
       SELECT md5(j.id || ':invoice')::uuid, j.bid, j.id,
         b.next_invoice_number - 1 + row_number() OVER (PARTITION BY j.bid ORDER BY j.ws, j.id),
         j.ws + interval '3 hours', j.price, 0, j.price,
         jsonb_build_array(jsonb_build_object('kind', 'service', 'description', 'Two-step paint correction',
           'quantity', 1, 'unitPriceMinor', j.price, 'amountMinor', j.price)),
         'No tax', j.ws + interval '3 hours'
       FROM gj j JOIN businesses b ON b.id = j.bid
       WHERE j.stage = 'closed' AND NOT EXISTS (SELECT 1 FROM invoices i WHERE i.id = md5(j.id || ':invoice')::uuid)`,
    );
    await db.query(`
      UPDATE businesses b SET next_invoice_number = x.n + 1
      FROM (SELECT business_id, max(number) AS n FROM invoices
            WHERE business_id IN (SELECT id FROM gen_b) GROUP BY business_id) x
      WHERE b.id = x.business_id`);
    await run(
      'stock_movements',
      `INSERT INTO stock_movements (id, business_id, product_id, qty, reason, job_id, source_type,
         source_id, unit_cost_minor, created_at)
       SELECT md5(j.id || ':use:' || p.key || ':' || s)::uuid, j.bid, ${prod('(s - 1) % 2')}, -30, 'use',
         j.id, 'pass', md5(j.id || ':pass:' || p.key || ':' || s)::uuid, 2.5, j.ws + interval '1 hour'
       FROM gj j, (VALUES ${panelValues}) AS p(i, key, label, band, substrate, area),
         generate_series(1, ${d.passesPerPanel}) s
       WHERE ${worked} AND p.i < ${d.stockUses} ON CONFLICT DO NOTHING`,
    );
    await db.query('DROP TABLE IF EXISTS gj');
    return counts;
  });
}

/** Rows per synced table (whole database). */
export async function tableCounts(db) {
  const out = {};
  for (const t of shared.SYNC_TABLES) {
    const { rows } = await db.query(`SELECT count(*)::int AS n FROM ${t}`);
    out[t] = rows[0].n;
  }
  return out;
}

/** YYYY-MM-DD of a day `offset` days from `today` (UTC). */
export function dayFrom(today, offset) {
  return new Date(Date.parse(`${today}T00:00:00Z`) + offset * 86_400_000)
    .toISOString()
    .slice(0, 10);
}
