#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  duckDbFault
} from "./chunk-DNRMFYPZ.js";
import {
  DataFaultError,
  ExternalError,
  UsageError
} from "./chunk-OICJSZPX.js";
import "./chunk-FUJ7I5KY.js";

// src/adapters/sql/duckdb.ts
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
var INSTALL_HINT = "install it with `npm install @duckdb/node-api` (an optional dependency of Plumbline), or run the query elsewhere: plumbline totals <plan> --sql --dialect <name>, then --from-rows";
async function loadDuckDb() {
  try {
    return await import("@duckdb/node-api");
  } catch (error) {
    throw new UsageError(`the embedded engine (the package @duckdb/node-api) is not installed${error instanceof Error ? `: ${error.message.split("\n")[0]}` : ""}`, INSTALL_HINT);
  }
}
async function runDuckDbQuery(sql, options) {
  const duckdb = await loadDuckDb();
  let instance;
  let timer;
  const spill = await mkdtemp(join(tmpdir(), "plumbline-duckdb-"));
  try {
    instance = await duckdb.DuckDBInstance.create(":memory:", {
      memory_limit: options.memoryLimit,
      temp_directory: spill,
      ...options.threads ? { threads: String(options.threads) } : {}
    });
    const connection = await instance.connect();
    try {
      await connection.run("SET TimeZone = 'UTC'").catch(() => void 0);
      if (options.progress) {
        await connection.run("SET enable_progress_bar = true; SET enable_progress_bar_print = false");
        const report = options.progress;
        timer = setInterval(() => {
          const { percentage } = connection.progress;
          if (percentage >= 0) report(Math.min(1, percentage / 100));
        }, 250);
      }
      const reader = await connection.runAndReadAll(sql);
      const columns = reader.columnNames();
      const rows = reader.getRows().map((row) => row.map((value) => value === null || value === void 0 ? null : String(value)));
      return { columns, rows };
    } finally {
      connection.closeSync();
    }
  } catch (error) {
    if (error instanceof UsageError) throw error;
    const message = error instanceof Error ? error.message : String(error);
    const hint = "check data.exposures and data.events in the settings (files, columns; data.exposures.experiment: false when the exposures have no experiment column) or --data; --sql prints the query";
    const fault = duckDbFault(message);
    if (fault) throw new DataFaultError(`DuckDB could not run the totals query: ${message.split("\n")[0]}`, hint, fault, { cause: error });
    throw new ExternalError(`DuckDB could not run the totals query: ${message.split("\n")[0]}`, hint, { cause: error });
  } finally {
    if (timer) clearInterval(timer);
    instance?.closeSync();
    await rm(spill, { recursive: true, force: true });
  }
}
export {
  runDuckDbQuery
};
