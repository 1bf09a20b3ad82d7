import pg from 'pg';
import type { EventRow, ExposureRow } from '../helpers/reference-totals.js';

/**
 * A PostgreSQL schema of its own for one test file: connects with PLUMBLINE_TEST_PG_URL (or the PG*
 * variables), creates a fresh schema, loads the raw rows, drops it at the end. Without a server it
 * returns undefined locally and throws in CI (`CI` set), so CI never skips the real-engine check.
 */
export interface TestPostgres {
  url: string;
  schema: string;
  load(data: { exposures: readonly ExposureRow[]; events: readonly EventRow[] }, segments: string[]): Promise<void>;
  query(sql: string): Promise<unknown[]>;
  close(): Promise<void>;
}

export async function connectTestPostgres(name: string): Promise<TestPostgres | undefined> {
  const url = process.env.PLUMBLINE_TEST_PG_URL ?? (process.env.PGHOST ? `postgres://${process.env.PGUSER ?? 'postgres'}@${process.env.PGHOST}:${process.env.PGPORT ?? 5432}/${process.env.PGDATABASE ?? 'postgres'}` : undefined);
  const client = new pg.Client(url ? { connectionString: url } : {});
  try {
    if (!url) throw new Error('PLUMBLINE_TEST_PG_URL is not set');
    await client.connect();
  } catch (error) {
    if (process.env.CI) throw new Error(`no PostgreSQL server for the engine tests: ${error instanceof Error ? error.message : String(error)}`);
    console.warn(`skipping the PostgreSQL checks: ${error instanceof Error ? error.message : String(error)}`);
    return undefined;
  }
  const schema = `plumbline_${name}_${process.pid}_${Date.now()}`;
  await client.query(`CREATE SCHEMA "${schema}"`);
  const insert = async (table: string, columns: string[], rows: unknown[][]) => {
    for (let i = 0; i < rows.length; i += 500) {
      const chunk = rows.slice(i, i + 500);
      const params = chunk.flat();
      const values = chunk.map((r, j) => `(${r.map((_, k) => `$${j * r.length + k + 1}`).join(', ')})`).join(', ');
      await client.query(`INSERT INTO "${schema}"."${table}" (${columns.map((c) => `"${c}"`).join(', ')}) VALUES ${values}`, params);
    }
  };
  return {
    url: url!,
    schema,
    async load(data, segments) {
      await client.query(`CREATE TABLE "${schema}".exposures (unit_id text, arm text, exposed_at timestamptz, experiment text${segments.map((s) => `, "${s}" text`).join('')})`);
      await client.query(`CREATE TABLE "${schema}".events (unit_id text, event text, occurred_at timestamptz, value double precision)`);
      await insert('exposures', ['unit_id', 'arm', 'exposed_at', 'experiment', ...segments], data.exposures.map((x) => [x.unit_id, x.arm, x.exposed_at, x.experiment ?? null, ...segments.map((s) => x[s] ?? null)]));
      await insert('events', ['unit_id', 'event', 'occurred_at', 'value'], data.events.map((e) => [e.unit_id, e.event, e.occurred_at, e.value]));
    },
    async query(sql) {
      return (await client.query(sql)).rows;
    },
    async close() {
      await client.query(`DROP SCHEMA "${schema}" CASCADE`).catch(() => undefined);
      await client.end();
    },
  };
}
