import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { DataFaultError, ExternalError, UsageError } from '../../errors.js';
import { duckDbFault } from './engine-faults.js';
import type { QueryProgress, QueryResult } from './result.js';

/**
 * The embedded engine: DuckDB in this process, through the optional package `@duckdb/node-api`, loaded
 * only here (and only when a command runs a query), so no other command pays for it or needs it.
 */

export interface DuckDbOptions {
  /** DuckDB's memory limit, e.g. 1.5GiB; beyond it, it spills to a temporary folder. */
  memoryLimit: string;
  threads?: number;
  progress?: QueryProgress;
}

const INSTALL_HINT = 'install it with `npm install @duckdb/node-api` (an optional dependency of Plumbline), or run the query elsewhere: plumbline totals <plan> --sql --dialect <name>, then --from-rows';

async function loadDuckDb(): Promise<typeof import('@duckdb/node-api')> {
  try {
    return await import('@duckdb/node-api');
  } catch (error) {
    throw new UsageError(`the embedded engine (the package @duckdb/node-api) is not installed${error instanceof Error ? `: ${error.message.split('\n')[0]}` : ''}`, INSTALL_HINT);
  }
}

/** Runs one query over files (or nothing) and returns its rows as text; decimals stay exact. */
export async function runDuckDbQuery(sql: string, options: DuckDbOptions): Promise<QueryResult> {
  const duckdb = await loadDuckDb();
  let instance: InstanceType<typeof duckdb.DuckDBInstance> | undefined;
  let timer: NodeJS.Timeout | undefined;
  // Past its memory limit DuckDB spills to disk, by default into `.tmp/` under the current folder: the user's
  // repository. A folder of our own under the system's temporary folder instead, removed when the query ends.
  const spill = await mkdtemp(join(tmpdir(), 'plumbline-duckdb-'));
  try {
    instance = await duckdb.DuckDBInstance.create(':memory:', {
      memory_limit: options.memoryLimit,
      temp_directory: spill,
      ...(options.threads ? { threads: String(options.threads) } : {}),
    });
    const connection = await instance.connect();
    try {
      // With the time-zone extension (ICU) loaded, a timestamp without a zone is read in the session's
      // zone: make that UTC. Without the extension DuckDB reads every timestamp as UTC already.
      await connection.run("SET TimeZone = 'UTC'").catch(() => undefined);
      if (options.progress) {
        // Set on the connection: DuckDB refuses these two as instance options ("Failed to set config").
        await connection.run('SET enable_progress_bar = true; SET enable_progress_bar_print = false');
        const report = options.progress;
        timer = setInterval(() => {
          const { percentage } = connection.progress;
          if (percentage >= 0) report(Math.min(1, percentage / 100));
        }, 250);
      }
      const reader = await connection.runAndReadAll(sql);
      const columns = reader.columnNames();
      const rows = reader.getRows().map((row) => row.map((value) => (value === null || value === undefined ? null : String(value))));
      return { columns, rows };
    } finally {
      connection.closeSync();
    }
  } catch (error) {
    if (error instanceof UsageError) throw error;
    const message = error instanceof Error ? error.message : String(error);
    const hint = 'check data.exposures and data.events in the settings (files, columns; data.exposures.experiment: false when the exposures have no experiment column) or --data; --sql prints the query';
    const fault = duckDbFault(message);
    if (fault) throw new DataFaultError(`DuckDB could not run the totals query: ${message.split('\n')[0]}`, hint, fault, { cause: error });
    throw new ExternalError(`DuckDB could not run the totals query: ${message.split('\n')[0]}`, hint, { cause: error });
  } finally {
    if (timer) clearInterval(timer);
    instance?.closeSync();
    await rm(spill, { recursive: true, force: true });
  }
}
