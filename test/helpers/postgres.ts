/**
 * A real PostgreSQL server for the SQL totals tests. Connects with PLUMBLINE_TEST_PG_URL (a postgres:// URL) or, when
 * it is not set, the standard libpq variables (PGHOST, PGPORT, PGUSER, PGPASSWORD, PGDATABASE) that `pg` reads.
 * Each test file gets a fresh schema of its own, dropped with everything in it after the file's tests.
 *
 * When no server answers: in CI (`CI` set) the file fails, because .ci/run starts a throwaway cluster and the engine
 * tests must run there; elsewhere the file's tests skip with a message saying how to run them.
 */
import { afterAll } from 'vitest';
import type { Client } from 'pg';

export interface TestPostgres {
  client: Client;
  /** The schema made for this file; the generated tables go here. */
  schema: string;
  /** Variables for a child process (e.g. `plumbline totals --engine postgres`): PG* and the schema as search_path. */
  env: Record<string, string>;
}

const HOW_TO = 'set PLUMBLINE_TEST_PG_URL=postgres://user@127.0.0.1:5432/postgres (or the PG* variables) to run them';

/** Error codes of a connection that found nobody listening (as opposed to a server saying no). */
const NO_SERVER = new Set(['ECONNREFUSED', 'ENOENT', 'EHOSTUNREACH', 'ENETUNREACH', 'EADDRNOTAVAIL', 'ETIMEDOUT', 'ENOTFOUND', 'EAI_AGAIN']);

function noServer(error: unknown): boolean {
  const e = error as { code?: string; message?: string; errors?: unknown[] };
  if (e.code && NO_SERVER.has(e.code)) return true;
  // Node reports a refused dual-stack connection as an AggregateError of the attempts.
  if (Array.isArray(e.errors) && e.errors.length > 0 && e.errors.every(noServer)) return true;
  return /timeout/i.test(e.message ?? '');
}

function describeTarget(): string {
  if (process.env.PLUMBLINE_TEST_PG_URL) return `PLUMBLINE_TEST_PG_URL (${process.env.PLUMBLINE_TEST_PG_URL.replace(/:[^:@/]*@/, ':***@')})`;
  const host = process.env.PGHOST ?? 'localhost';
  return `PG* variables (${host}:${process.env.PGPORT ?? '5432'})`;
}

/**
 * Opens a connection and a fresh schema for the calling test file, or returns undefined (after saying why) when no
 * server answers outside CI. Call it at the top level of a test file:
 *
 *   const pg = await postgresForThisFile('engines');
 *   describe.skipIf(!pg)('PostgreSQL', () => { ... pg!.client ... });
 */
export async function postgresForThisFile(label: string): Promise<TestPostgres | undefined> {
  const { default: pgModule } = await import('pg');
  const url = process.env.PLUMBLINE_TEST_PG_URL;
  const client = new pgModule.Client({ ...(url ? { connectionString: url } : {}), connectionTimeoutMillis: 5000 });
  try {
    await client.connect();
  } catch (error) {
    await client.end().catch(() => undefined);
    if (!noServer(error)) {
      throw new Error(`PostgreSQL at ${describeTarget()} answered but refused the connection: ${(error as Error).message}`);
    }
    const message = `no PostgreSQL server answers at ${describeTarget()}: ${(error as Error).message}`;
    if (process.env.CI) {
      throw new Error(`${message}. CI must run the PostgreSQL tests: .ci/run starts a throwaway cluster and sets PLUMBLINE_TEST_PG_URL.`);
    }
    console.warn(`[${label}] PostgreSQL tests skipped: ${message}; ${HOW_TO}.`);
    return undefined;
  }
  const schema = `plumbline_${label.replace(/[^a-z0-9]+/gi, '_').toLowerCase()}_${process.pid}_${Math.floor(Math.random() * 1e9).toString(36)}`;
  await client.query(`CREATE SCHEMA "${schema}"`);
  await client.query(`SET search_path TO "${schema}"`);
  afterAll(async () => {
    try {
      await client.query(`DROP SCHEMA IF EXISTS "${schema}" CASCADE`);
    } finally {
      await client.end();
    }
  });
  const env: Record<string, string> = {
    PGHOST: client.host,
    PGPORT: String(client.port),
    PGUSER: client.user ?? '',
    PGDATABASE: client.database ?? '',
    PGOPTIONS: `-c search_path=${schema}`,
  };
  if (typeof client.password === 'string' && client.password) env.PGPASSWORD = client.password;
  return { client, schema, env };
}
