/**
 * Deterministic raw experiment data for the SQL totals tests: the exposure and event tables of the demo's overdue
 * test (checkout-wallet-first, window 2026-11-09 to 2026-12-06, control and treatment at 50/50), with effects
 * planted at known sizes and with the dirt real logging tables have. The same rows are written as CSV and Parquet
 * files (Parquet through DuckDB) and loaded into PostgreSQL, so every engine reads the same thing.
 *
 * Table shapes (the contract of issue 12):
 * - exposures: unit_id text, arm text, exposed_at timestamptz, experiment text, platform text
 * - events: unit_id text, event text, occurred_at timestamptz, value double (may be NULL)
 *
 * The dirt, each kind counted in `GeneratedData.dirt` so a test can check it reached the engine:
 * duplicate exposure rows of one unit (same arm, later or identical), units exposed in two arms, units exposed only
 * in an arm the plan does not have, events before exposure (the pre-period, and older), events after the end of the
 * data window, NULL values (event values, and a few rows with no unit id), exposures at a UTC day boundary written
 * with offsets of +09:00 and -05:00 (local day and UTC day differ; in CSV the text keeps the offset), exposures just
 * outside the window, rows of another experiment (when the experiment column is written), and events of names no
 * metric uses.
 *
 * Values are whole multiples of 1/4, so every sum, sum of squares and cross-product is exact in binary floating point
 * whatever the order of addition: two engines' totals can be compared for identity, not within a tolerance.
 */
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { seededRandom } from './random.js';

/** The demo's overdue test: live, with its planned end (2026-12-06) before the demo's today (2026-12-08). */
export const OVERDUE_PLAN = {
  id: 'checkout-wallet-first',
  file: 'experiments/checkout-wallet-first.yaml',
  windowStart: '2026-11-09',
  windowEnd: '2026-12-06',
  /** The plan's window end is its last day of data: the readout is due. */
  dataThrough: '2026-12-06',
  arms: [
    { name: 'control', weight: 50 },
    { name: 'treatment', weight: 50 },
  ],
  control: 'control',
  exposureEvent: 'checkout_payment_viewed',
} as const;

/** Another live test sharing some units; its rows are in the tables when the experiment column is written. */
export const OTHER_EXPERIMENT = { id: 'checkout-tip-prompt', arms: ['control', 'fixed-amounts', 'percent-of-order'] } as const;

/** The planted primary: the share of units that place an order, raised by a known relative lift in treatment. */
export const PLANTED_PRIMARY = {
  metric: 'payment-completed',
  event: 'order_placed',
  kind: 'proportion',
  controlRate: 0.82,
  relativeLift: 0.04,
  /** treatment rate = controlRate × (1 + relativeLift) */
  treatmentRate: 0.82 * 1.04,
  absoluteLift: 0.82 * 0.04,
} as const;

/**
 * The planted guardrail, unchanged between the arms. Its event is `payment_failed`: the demo plan lists
 * `order_placed` for payment-errors too (which would make the guardrail a copy of the primary), so a test that reads
 * the guardrail out points the plan's copy at this event (see `GUARDRAIL_EVENT_FIX`).
 */
export const PLANTED_GUARDRAIL = {
  metric: 'payment-errors',
  event: 'payment_failed',
  kind: 'proportion',
  rate: 0.015,
  relativeLift: 0,
} as const;

/** The demo plan's payment-errors guardrail lists order_placed; this is the edit a test applies to its copy. */
export const GUARDRAIL_EVENT_FIX = {
  from: '      events: [order_placed]\n      direction: decrease',
  to: `      events: [${PLANTED_GUARDRAIL.event}]\n      direction: decrease`,
} as const;

/** Order value, carried on order_placed events in `value`; the same mean in both arms (no planted effect). */
export const PLANTED_ORDER_VALUE = { event: 'order_placed', meanPerOrder: 42, nullShare: 0.05 } as const;

/** Days of history before exposure that the pre-period value (CUPED) is taken over. */
export const PRE_PERIOD_DAYS = 28;

/** A unit's share of being a regular customer; regulars order more before and during the test (CUPED has signal). */
const REGULAR_SHARE = 0.6;
/** Order rates of regulars and of the rest, chosen so REGULAR_SHARE × 0.9 + 0.4 × 0.7 = 0.82, the control rate. */
const REGULAR_RATE = 0.9;
const OCCASIONAL_RATE = 0.7;

const DAY_MS = 86_400_000;
const HOUR_MS = 3_600_000;

/** A moment, with the UTC offset (minutes) its text is written with in CSV and loaded into PostgreSQL. */
export interface Instant {
  utcMs: number;
  offsetMinutes: number;
}

export interface ExposureRow {
  unitId: string | null;
  arm: string | null;
  exposedAt: Instant;
  experiment: string;
  platform: string | null;
}

export interface EventRow {
  unitId: string | null;
  event: string;
  occurredAt: Instant;
  value: number | null;
}

/** Counts of each kind of dirt, by construction. */
export interface DirtCounts {
  /** Units with a second exposure row in the same arm. */
  duplicateExposureUnits: number;
  /** Units exposed in both arms of the plan (to be excluded and counted). */
  severalArmUnits: number;
  /** Units exposed only in arms the plan does not have. */
  unknownArmUnits: number;
  /** Exposure rows with an arm the plan does not have. */
  unknownArmRows: number;
  /** Units whose exposure text lands on another local day than its UTC day (+09:00 or -05:00). */
  dayBoundaryUnits: number;
  /** Units exposed only just before the window start or after the data end (in UTC; inside it in local time). */
  outsideWindowUnits: number;
  /** Event rows of a metric's event before the unit's exposure. */
  eventsBeforeExposure: number;
  /** Event rows at or after the end of data-through. */
  eventsAfterWindow: number;
  /** Event rows with a NULL value. */
  nullValues: number;
  /** Rows (exposures plus events) with a NULL unit id. */
  nullUnitRows: number;
  /** Exposure rows of the other experiment. */
  otherExperimentRows: number;
}

export interface GeneratedData {
  seed: number;
  exposures: ExposureRow[];
  events: EventRow[];
  dirt: DirtCounts;
  /** Clean units assigned to each arm (before exclusions), by construction. */
  assigned: Record<string, number>;
}

export interface GenerateOptions {
  /** Default 1. */
  seed?: number;
  /** Units randomized into the test, before the dirt is added. Default 24,000. */
  units?: number;
  /** Relative lift of the primary in treatment. Default PLANTED_PRIMARY.relativeLift. */
  relativeLift?: number;
}

/** Builds the tables. The same options give the same rows, row for row. */
export function generateData(options: GenerateOptions = {}): GeneratedData {
  const seed = options.seed ?? 1;
  const unitCount = options.units ?? 24_000;
  const lift = options.relativeLift ?? PLANTED_PRIMARY.relativeLift;
  const random = seededRandom(seed);
  const pick = <T>(items: readonly T[]): T => items[Math.floor(random() * items.length)]!;
  const chance = (p: number) => random() < p;

  const start = Date.parse(`${OVERDUE_PLAN.windowStart}T00:00:00Z`);
  const dataEnd = Date.parse(`${OVERDUE_PLAN.dataThrough}T00:00:00Z`) + DAY_MS;
  const days = Math.round((dataEnd - start) / DAY_MS);
  const exposures: ExposureRow[] = [];
  const events: EventRow[] = [];
  const dirt: DirtCounts = {
    duplicateExposureUnits: 0,
    severalArmUnits: 0,
    unknownArmUnits: 0,
    unknownArmRows: 0,
    dayBoundaryUnits: 0,
    outsideWindowUnits: 0,
    eventsBeforeExposure: 0,
    eventsAfterWindow: 0,
    nullValues: 0,
    nullUnitRows: 0,
    otherExperimentRows: 0,
  };
  const assigned: Record<string, number> = Object.fromEntries(OVERDUE_PLAN.arms.map((a) => [a.name, 0]));
  const totalWeight = OVERDUE_PLAN.arms.reduce((s, a) => s + a.weight, 0);
  const armFor = (): string => {
    let u = random() * totalWeight;
    for (const arm of OVERDUE_PLAN.arms) {
      u -= arm.weight;
      if (u < 0) return arm.name;
    }
    return OVERDUE_PLAN.arms[OVERDUE_PLAN.arms.length - 1]!.name;
  };
  // Most rows are written in UTC; some as a client in Tokyo or New York logs them.
  const offsetFor = (): number => pick([0, 0, 0, 540, -300]);
  // Logged to the second, as the text form has no fraction.
  const at = (utcMs: number, offsetMinutes = offsetFor()): Instant => ({ utcMs: Math.floor(utcMs / 1000) * 1000, offsetMinutes });
  const platformFor = () => (chance(0.5) ? 'web' : chance(0.6) ? 'ios' : 'android');
  const quarter = (x: number) => Math.max(0.25, Math.round(x * 4) / 4);
  const orderValue = (): number | null => {
    if (chance(PLANTED_ORDER_VALUE.nullShare)) {
      dirt.nullValues++;
      return null;
    }
    // A skewed spend with the planted mean: exponential around the mean, in whole quarters.
    return quarter(-Math.log(1 - random()) * PLANTED_ORDER_VALUE.meanPerOrder);
  };
  const secondsIn = (from: number, to: number) => from + Math.floor(random() * Math.max(1, (to - from) / 1000)) * 1000;

  for (let i = 0; i < unitCount; i++) {
    const unitId = `u${String(i).padStart(7, '0')}`;
    const arm = armFor();
    assigned[arm]!++;
    const day = Math.floor(random() * days);
    let exposedAt = start + day * DAY_MS + Math.floor(random() * 86_400) * 1000;
    let offset = offsetFor();
    // Every 97th unit is exposed within an hour of a midnight, written so its local day differs from its UTC day:
    // near UTC midnight (just before it in Tokyo is the next local day; just after it in New York the previous one)
    // or near a local midnight (just after it in Tokyo, or just before it in New York).
    if (i % 97 === 5) {
      const minutes = (1 + Math.floor(random() * 59)) * 60_000;
      const midnight = start + Math.max(1, day) * DAY_MS;
      const boundary = Math.floor(random() * 4);
      if (boundary === 0) [exposedAt, offset] = [midnight - minutes, 540];
      else if (boundary === 1) [exposedAt, offset] = [midnight + minutes, -300];
      else if (boundary === 2) [exposedAt, offset] = [midnight - 9 * HOUR_MS + minutes, 540];
      else [exposedAt, offset] = [midnight + 5 * HOUR_MS - minutes, -300];
      dirt.dayBoundaryUnits++;
    }
    const platform = platformFor();
    exposures.push({ unitId, arm, exposedAt: at(exposedAt, offset), experiment: OVERDUE_PLAN.id, platform });
    // The exposure event itself, logged too: a name no metric uses.
    events.push({ unitId, event: OVERDUE_PLAN.exposureEvent, occurredAt: at(exposedAt, offset), value: null });

    if (chance(0.03)) {
      dirt.duplicateExposureUnits++;
      // A retry logs the same row again, or a later visit logs a second exposure in the same arm.
      const again = chance(0.5) ? exposedAt : Math.min(dataEnd - 1000, exposedAt + Math.floor(random() * 3 * DAY_MS));
      exposures.push({ unitId, arm, exposedAt: at(again), experiment: OVERDUE_PLAN.id, platform });
    }
    if (chance(0.005)) {
      dirt.severalArmUnits++;
      const other = OVERDUE_PLAN.arms.find((a) => a.name !== arm)!.name;
      const later = secondsIn(exposedAt, dataEnd);
      exposures.push({ unitId, arm: other, exposedAt: at(later), experiment: OVERDUE_PLAN.id, platform });
    }
    if (chance(0.1)) {
      // Also in the other test; those rows only count when the experiment column is not read.
      dirt.otherExperimentRows++;
      exposures.push({ unitId, arm: pick(OTHER_EXPERIMENT.arms), experiment: OTHER_EXPERIMENT.id, exposedAt: at(secondsIn(start, dataEnd)), platform });
    }

    const regular = chance(REGULAR_SHARE);
    const baseRate = regular ? REGULAR_RATE : OCCASIONAL_RATE;
    const rate = arm === OVERDUE_PLAN.control ? baseRate : baseRate * (1 + lift);
    // Orders after exposure, up to the end of the data.
    if (chance(rate)) {
      const orders = 1 + (chance(0.35) ? 1 : 0) + (chance(0.1) ? 1 : 0);
      for (let k = 0; k < orders; k++) {
        events.push({ unitId, event: PLANTED_PRIMARY.event, occurredAt: at(secondsIn(exposedAt, Math.min(dataEnd, exposedAt + 7 * DAY_MS))), value: orderValue() });
      }
    }
    // The pre-period: orders in the 28 days before exposure, more likely for regulars.
    if (chance(regular ? 0.85 : 0.3)) {
      const orders = 1 + (chance(0.4) ? 1 : 0);
      for (let k = 0; k < orders; k++) {
        dirt.eventsBeforeExposure++;
        events.push({ unitId, event: PLANTED_PRIMARY.event, occurredAt: at(secondsIn(exposedAt - PRE_PERIOD_DAYS * DAY_MS, exposedAt)), value: orderValue() });
      }
    }
    // Older history, outside the pre-period.
    if (chance(0.1)) {
      dirt.eventsBeforeExposure++;
      events.push({ unitId, event: PLANTED_PRIMARY.event, occurredAt: at(exposedAt - (PRE_PERIOD_DAYS + 5) * DAY_MS - Math.floor(random() * 20 * DAY_MS)), value: orderValue() });
    }
    // Orders after the data window: a late batch, some written on the last local day in New York.
    if (chance(0.05)) {
      dirt.eventsAfterWindow++;
      const late = dataEnd + Math.floor(random() * 4 * HOUR_MS);
      events.push({ unitId, event: PLANTED_PRIMARY.event, occurredAt: at(late, chance(0.5) ? -300 : 0), value: orderValue() });
    }
    if (chance(PLANTED_GUARDRAIL.rate)) {
      events.push({ unitId, event: PLANTED_GUARDRAIL.event, occurredAt: at(secondsIn(exposedAt, dataEnd)), value: null });
    }
    if (chance(0.3)) events.push({ unitId, event: 'basket_viewed', occurredAt: at(secondsIn(exposedAt - DAY_MS, dataEnd)), value: null });
  }

  // Units in an arm the plan does not have: a renamed arm and a casing slip in the flag's variant.
  for (let i = 0; i < Math.max(4, Math.round(unitCount * 0.003)); i++) {
    const unitId = `x${String(i).padStart(6, '0')}`;
    const exposedAt = secondsIn(start, dataEnd);
    dirt.unknownArmUnits++;
    for (const arm of chance(0.3) ? ['Treatment', 'Treatment'] : [pick(['Treatment', 'wallet-first'])]) {
      dirt.unknownArmRows++;
      exposures.push({ unitId, arm, exposedAt: at(exposedAt), experiment: OVERDUE_PLAN.id, platform: platformFor() });
    }
    events.push({ unitId, event: PLANTED_PRIMARY.event, occurredAt: at(exposedAt + HOUR_MS), value: orderValue() });
  }

  // Units whose only exposure is just outside the window in UTC, though on a window day in local time.
  const edges: [number, number][] = [
    [start - 30 * 60_000, 540], // 2026-11-08T23:30Z, written 2026-11-09T08:30:00+09:00
    [dataEnd + 30 * 60_000, -300], // 2026-12-07T00:30Z, written 2026-12-06T19:30:00-05:00
  ];
  for (let i = 0; i < 6; i++) {
    const [utcMs, offset] = edges[i % 2]!;
    const unitId = `e${String(i).padStart(6, '0')}`;
    dirt.outsideWindowUnits++;
    if (utcMs >= dataEnd) dirt.eventsAfterWindow++;
    exposures.push({ unitId, arm: armFor(), exposedAt: at(utcMs, offset), experiment: OVERDUE_PLAN.id, platform: platformFor() });
    events.push({ unitId, event: PLANTED_PRIMARY.event, occurredAt: at(utcMs + HOUR_MS), value: orderValue() });
  }

  // A few rows with no unit id at all: a logging bug that must not become one big unit.
  for (let i = 0; i < 3; i++) {
    dirt.nullUnitRows += 2;
    const when = secondsIn(start, dataEnd);
    exposures.push({ unitId: null, arm: armFor(), exposedAt: at(when), experiment: OVERDUE_PLAN.id, platform: null });
    events.push({ unitId: null, event: PLANTED_PRIMARY.event, occurredAt: at(when + HOUR_MS), value: orderValue() });
  }

  // Logged rows arrive out of order: shuffle deterministically so no engine can rely on row order.
  shuffle(exposures, random);
  shuffle(events, random);
  return { seed, exposures, events, dirt, assigned };
}

function shuffle<T>(items: T[], random: () => number): void {
  for (let i = items.length - 1; i > 0; i--) {
    const j = Math.floor(random() * (i + 1));
    [items[i], items[j]] = [items[j]!, items[i]!];
  }
}

/** ISO-8601 text of an instant in its own offset, e.g. 2026-11-09T23:30:00-05:00 (UTC as +00:00). */
export function isoWithOffset(instant: Instant): string {
  const local = new Date(instant.utcMs + instant.offsetMinutes * 60_000).toISOString().slice(0, 19);
  const sign = instant.offsetMinutes < 0 ? '-' : '+';
  const abs = Math.abs(instant.offsetMinutes);
  return `${local}${sign}${String(Math.floor(abs / 60)).padStart(2, '0')}:${String(abs % 60).padStart(2, '0')}`;
}

export interface WriteOptions {
  /** Write the `experiment` column (and the other experiment's rows). Default true. */
  experimentColumn?: boolean;
}

/** The rows a table gets: without the experiment column, the other experiment's rows are not in the export. */
function exposuresFor(data: GeneratedData, options: WriteOptions): ExposureRow[] {
  return options.experimentColumn === false ? data.exposures.filter((r) => r.experiment === OVERDUE_PLAN.id) : data.exposures;
}

export const EXPOSURE_COLUMNS = ['unit_id', 'arm', 'exposed_at', 'experiment', 'platform'] as const;
export const EVENT_COLUMNS = ['unit_id', 'event', 'occurred_at', 'value'] as const;

/** Table rows as text fields (null for NULL), in the column order above. */
export function exposureFields(data: GeneratedData, options: WriteOptions = {}): (string | null)[][] {
  const withExperiment = options.experimentColumn !== false;
  return exposuresFor(data, options).map((r) =>
    withExperiment ? [r.unitId, r.arm, isoWithOffset(r.exposedAt), r.experiment, r.platform] : [r.unitId, r.arm, isoWithOffset(r.exposedAt), r.platform],
  );
}

export function eventFields(data: GeneratedData): (string | null)[][] {
  return data.events.map((r) => [r.unitId, r.event, isoWithOffset(r.occurredAt), r.value === null ? null : String(r.value)]);
}

function exposureHeader(options: WriteOptions): string[] {
  return options.experimentColumn === false ? EXPOSURE_COLUMNS.filter((c) => c !== 'experiment') : [...EXPOSURE_COLUMNS];
}

function csvText(header: readonly string[], rows: (string | null)[][]): string {
  // No generated field holds a comma, quote or newline; NULL is an empty field.
  return `${header.join(',')}\n${rows.map((r) => r.map((f) => f ?? '').join(',')).join('\n')}\n`;
}

export interface WrittenFiles {
  exposures: string;
  events: string;
}

/** Writes exposures.csv and events.csv (header row; timestamps as ISO-8601 text with each row's offset). */
export function writeCsv(data: GeneratedData, folder: string, options: WriteOptions = {}): WrittenFiles {
  mkdirSync(folder, { recursive: true });
  const files = { exposures: join(folder, 'exposures.csv'), events: join(folder, 'events.csv') };
  writeFileSync(files.exposures, csvText(exposureHeader(options), exposureFields(data, options)));
  writeFileSync(files.events, csvText(EVENT_COLUMNS, eventFields(data)));
  return files;
}

/** Loads `@duckdb/node-api`, which is an optional dependency. */
export async function loadDuckDb(): Promise<typeof import('@duckdb/node-api')> {
  try {
    return await import('@duckdb/node-api');
  } catch (error) {
    throw new Error(`@duckdb/node-api is not installed (install it with \`npm install @duckdb/node-api\`): ${(error as Error).message}`);
  }
}

const sqlString = (text: string) => `'${text.replaceAll("'", "''")}'`;

/**
 * Writes exposures.parquet and events.parquet: DuckDB reads the CSV text (offsets included) and writes
 * TIMESTAMP WITH TIME ZONE columns, i.e. UTC instants.
 */
export async function writeParquet(data: GeneratedData, folder: string, options: WriteOptions = {}): Promise<WrittenFiles> {
  mkdirSync(folder, { recursive: true });
  const scratch = mkdtempSync(join(tmpdir(), 'plumbline-gen-'));
  const { DuckDBInstance } = await loadDuckDb();
  const instance = await DuckDBInstance.create(':memory:');
  const connection = await instance.connect();
  try {
    const csv = writeCsv(data, scratch, options);
    const files = { exposures: join(folder, 'exposures.parquet'), events: join(folder, 'events.parquet') };
    const exposureTypes = exposureHeader(options)
      .map((c) => `${sqlString(c)}: ${c === 'exposed_at' ? "'TIMESTAMPTZ'" : "'VARCHAR'"}`)
      .join(', ');
    await connection.run("SET TimeZone = 'UTC'");
    await connection.run(
      `COPY (SELECT * FROM read_csv(${sqlString(csv.exposures)}, header = true, columns = {${exposureTypes}})) TO ${sqlString(files.exposures)} (FORMAT parquet)`,
    );
    await connection.run(
      `COPY (SELECT * FROM read_csv(${sqlString(csv.events)}, header = true, columns = {'unit_id': 'VARCHAR', 'event': 'VARCHAR', 'occurred_at': 'TIMESTAMPTZ', 'value': 'DOUBLE'})) TO ${sqlString(files.events)} (FORMAT parquet)`,
    );
    return files;
  } finally {
    connection.closeSync();
    instance.closeSync();
    rmSync(scratch, { recursive: true, force: true });
  }
}

/** The smallest part of `pg`'s client this needs, so tests can pass a Client or a PoolClient. */
export interface SqlClient {
  query(text: string, values?: unknown[]): Promise<{ rows: Record<string, unknown>[] }>;
}

const quoteIdent = (name: string) => `"${name.replaceAll('"', '""')}"`;

/**
 * Creates `<schema>.exposures` and `<schema>.events` (timestamptz columns) and loads the rows with multi-row
 * parameterized inserts; PostgreSQL parses each timestamp's text with its own offset.
 */
export async function loadIntoPostgres(client: SqlClient, schema: string, data: GeneratedData, options: WriteOptions = {}): Promise<void> {
  const s = quoteIdent(schema);
  const withExperiment = options.experimentColumn !== false;
  await client.query(
    `CREATE TABLE ${s}.exposures (unit_id text, arm text, exposed_at timestamptz${withExperiment ? ', experiment text' : ''}, platform text)`,
  );
  await client.query(`CREATE TABLE ${s}.events (unit_id text, event text, occurred_at timestamptz, value double precision)`);
  await insertRows(client, `${s}.exposures`, exposureHeader(options).map(quoteIdent), exposureFields(data, options), { 2: 'timestamptz' });
  await insertRows(client, `${s}.events`, EVENT_COLUMNS.map(quoteIdent), eventFields(data), { 2: 'timestamptz', 3: 'double precision' });
  // Statistics, as a live table has them: without them the planner guesses row counts and picks nested loops.
  await client.query(`ANALYZE ${s}.exposures, ${s}.events`);
}

async function insertRows(client: SqlClient, table: string, columns: string[], rows: (string | null)[][], casts: Record<number, string>): Promise<void> {
  // PostgreSQL takes at most 65,535 parameters per statement.
  const perStatement = Math.floor(60_000 / columns.length);
  for (let from = 0; from < rows.length; from += perStatement) {
    const chunk = rows.slice(from, from + perStatement);
    const values: (string | null)[] = [];
    const tuples = chunk.map((row) => {
      const slots = row.map((field, c) => {
        values.push(field);
        return casts[c] ? `$${values.length}::${casts[c]}` : `$${values.length}`;
      });
      return `(${slots.join(', ')})`;
    });
    await client.query(`INSERT INTO ${table} (${columns.join(', ')}) VALUES ${tuples.join(', ')}`, values);
  }
}
