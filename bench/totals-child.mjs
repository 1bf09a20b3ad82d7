// Runs one SQL text with DuckDB in its own process, so its time and peak memory are its own (bench/totals.ts).
//   node bench/totals-child.mjs <sql-file> <memory-limit>
// Prints the result rows as JSON on stdout.
import { readFileSync } from 'node:fs';

const [sqlFile, memoryLimit] = process.argv.slice(2);
const { DuckDBInstance } = await import('@duckdb/node-api');
const instance = await DuckDBInstance.create(':memory:', { memory_limit: memoryLimit });
const connection = await instance.connect();
const reader = await connection.runAndReadAll(readFileSync(sqlFile, 'utf8'));
process.stdout.write(`${JSON.stringify(reader.getRowObjectsJson())}\n`);
connection.closeSync();
instance.closeSync();
