#!/usr/bin/env node
import { createRequire as __plumblineCreateRequire } from 'node:module';
const require = __plumblineCreateRequire(import.meta.url);
import {
  ExternalError,
  UsageError
} from "./chunk-TEADBEZM.js";
import "./chunk-FUJ7I5KY.js";

// src/adapters/sql/postgres.ts
function redactUrl(url) {
  try {
    const parsed = new URL(url);
    if (parsed.password) parsed.password = "***";
    for (const key of [...parsed.searchParams.keys()]) if (/pass/i.test(key)) parsed.searchParams.set(key, "***");
    return parsed.toString();
  } catch {
    return "the connection URL (not shown: it does not parse as a URL)";
  }
}
function withoutSecret(message, secret) {
  return secret ? message.split(secret).join("***") : message;
}
async function runPostgresQuery(sql, options, env = process.env) {
  let pg;
  try {
    pg = (await import("./esm-6FL3FSZG.js")).default;
  } catch (error) {
    throw new UsageError(`the PostgreSQL client (the package pg) is not installed${error instanceof Error ? `: ${error.message.split("\n")[0]}` : ""}`, "install it with `npm install pg`");
  }
  let secret;
  try {
    secret = options.url ? new URL(options.url).password || void 0 : env.PGPASSWORD;
  } catch {
    throw new UsageError("the database URL does not parse", "write it as postgres://user@host:5432/database (the password is better kept in PGPASSWORD)");
  }
  const where = options.url ? redactUrl(options.url) : `the PG* variables (host ${env.PGHOST ?? "localhost"}, port ${env.PGPORT ?? "5432"}, database ${env.PGDATABASE ?? env.PGUSER ?? "(your user name)"})`;
  const client = new pg.Client({ ...options.url ? { connectionString: options.url } : {}, types: { getTypeParser: () => (value) => value } });
  try {
    await client.connect();
  } catch (error) {
    throw new ExternalError(`cannot connect to PostgreSQL at ${where}: ${withoutSecret(error instanceof Error ? error.message : String(error), secret)}`, "set PLUMBLINE_DATABASE_URL, pass --url, or set the PG* variables (PGHOST, PGUSER, PGDATABASE, PGPASSWORD)");
  }
  try {
    await client.query("SET TIME ZONE 'UTC'");
    await client.query("SET enable_nestloop = off");
    const result = await client.query({ text: sql, rowMode: "array" });
    return { columns: result.fields.map((f) => f.name), rows: result.rows.map((row) => row.map((v) => v === null || v === void 0 ? null : String(v))) };
  } catch (error) {
    throw new ExternalError(`PostgreSQL could not run the totals query: ${withoutSecret(error instanceof Error ? error.message : String(error), secret)}`, "check data.exposures.table and data.events.table and their columns in the settings (data.exposures.experiment: false when there is no experiment column); --sql --dialect postgres prints the query");
  } finally {
    await client.end().catch(() => void 0);
  }
}
export {
  redactUrl,
  runPostgresQuery
};
