import { DataFaultError, ExternalError, UsageError } from '../../errors.js';
import { postgresFault } from './engine-faults.js';
import type { QueryResult } from './result.js';

/**
 * PostgreSQL through the `pg` client, loaded only here. The connection comes from a URL (--url or
 * PLUMBLINE_DATABASE_URL) or, without one, from the standard PG* variables (PGHOST, PGPORT, PGUSER,
 * PGPASSWORD, PGDATABASE, ...), which `pg` reads itself. No message ever shows the password.
 */

export interface PostgresOptions {
  /** A postgres:// URL; undefined means the PG* variables. */
  url?: string;
}

/** The URL with its password replaced, for messages. */
export function redactUrl(url: string): string {
  try {
    const parsed = new URL(url);
    if (parsed.password) parsed.password = '***';
    for (const key of [...parsed.searchParams.keys()]) if (/pass/i.test(key)) parsed.searchParams.set(key, '***');
    return parsed.toString();
  } catch {
    return 'the connection URL (not shown: it does not parse as a URL)';
  }
}

/** An error's message with any occurrence of the password taken out. */
function withoutSecret(message: string, secret: string | undefined): string {
  return secret ? message.split(secret).join('***') : message;
}

export async function runPostgresQuery(sql: string, options: PostgresOptions, env: NodeJS.ProcessEnv = process.env): Promise<QueryResult> {
  let pg: (typeof import('pg'))['default'];
  try {
    pg = (await import('pg')).default;
  } catch (error) {
    throw new UsageError(`the PostgreSQL client (the package pg) is not installed${error instanceof Error ? `: ${error.message.split('\n')[0]}` : ''}`, 'install it with `npm install pg`');
  }
  let secret: string | undefined;
  try {
    secret = options.url ? new URL(options.url).password || undefined : env.PGPASSWORD;
  } catch {
    throw new UsageError('the database URL does not parse', 'write it as postgres://user@host:5432/database (the password is better kept in PGPASSWORD)');
  }
  const where = options.url ? redactUrl(options.url) : `the PG* variables (host ${env.PGHOST ?? 'localhost'}, port ${env.PGPORT ?? '5432'}, database ${env.PGDATABASE ?? env.PGUSER ?? '(your user name)'})`;
  // Every value as text: NUMERIC sums stay exact decimals, BIGINT counts never pass through a double.
  const client = new pg.Client({ ...(options.url ? { connectionString: options.url } : {}), types: { getTypeParser: () => (value: string) => value } as never });
  try {
    await client.connect();
  } catch (error) {
    throw new ExternalError(`cannot connect to PostgreSQL at ${where}: ${withoutSecret(error instanceof Error ? error.message : String(error), secret)}`, 'set PLUMBLINE_DATABASE_URL, pass --url, or set the PG* variables (PGHOST, PGUSER, PGDATABASE, PGPASSWORD)');
  }
  try {
    // Timestamps without a time zone are read as UTC; the query never depends on the session zone otherwise.
    await client.query("SET TIME ZONE 'UTC'");
    // The query joins large row sets on equality only, through CTEs whose sizes the planner cannot see: on
    // such estimates (one row) it picks nested loops, which turn a 0.2 s query into minutes. Hash joins are
    // always right here (docs/totals-from-sql.md).
    await client.query('SET enable_nestloop = off');
    const result = await client.query({ text: sql, rowMode: 'array' });
    return { columns: result.fields.map((f) => f.name), rows: (result.rows as unknown[][]).map((row) => row.map((v) => (v === null || v === undefined ? null : String(v)))) };
  } catch (error) {
    const message = withoutSecret(error instanceof Error ? error.message : String(error), secret);
    const hint = 'check data.exposures.table and data.events.table and their columns in the settings (data.exposures.experiment: false when there is no experiment column); --sql --dialect postgres prints the query';
    const fault = postgresFault({ code: (error as { code?: string }).code, message });
    if (fault) throw new DataFaultError(`PostgreSQL could not run the totals query: ${message}`, hint, fault);
    throw new ExternalError(`PostgreSQL could not run the totals query: ${message}`, hint);
  } finally {
    await client.end().catch(() => undefined);
  }
}
