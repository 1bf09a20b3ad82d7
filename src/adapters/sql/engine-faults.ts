import type { DataFault } from '../../core/totals-query/diagnose.js';

/**
 * The engines' error texts read into facts (DataFault, core/totals-query/diagnose.ts). Each pattern is the engine's own
 * wording, checked by test/sql/data-faults.test.ts against the installed engine; text that matches none
 * stays the engine's message.
 */

/** DuckDB: a missing column, DuckDB's CSV reader failing at a line, or a cast of a column's value. */
export function duckDbFault(message: string): DataFault | undefined {
  const missing = /Referenced column "((?:[^"]|"")+)" not found/.exec(message);
  if (missing) return { kind: 'missing-column', column: missing[1]!.replace(/""/g, '"') };
  // "CSV Error on Line: 5 ... Error when converting column "value". Could not convert string "abc" to 'DOUBLE' ... file = /path"
  const csvLine = /CSV Error on Line: (\d+)/.exec(message);
  if (csvLine) {
    const converting = /Error when converting column "((?:[^"]|"")+)"\. Could not convert string "(.*?)" to '([^']+)'/.exec(message);
    const file = /^\s*file = (.+)$/m.exec(message)?.[1]?.trim();
    return {
      kind: 'bad-value',
      line: Number(csvLine[1]),
      ...(converting ? { column: converting[1]!.replace(/""/g, '"'), value: converting[2]!, type: converting[3]! } : {}),
      ...(file ? { file } : {}),
    };
  }
  // "Conversion Error: Could not convert string "abc" to DECIMAL(38,6) when casting from source column value"
  // "Conversion Error: timestamp field value out of range: "2026-13-45T..." when casting from source column exposed_at"
  if (/^Conversion Error:/.test(message)) {
    const value = /"((?:[^"\\]|\\.)*)"/.exec(message)?.[1];
    const column = /when casting from source column (\S+)/.exec(message)?.[1];
    return { kind: 'bad-value', ...(column ? { column } : {}), ...(value !== undefined ? { value } : {}) };
  }
  return undefined;
}

/** PostgreSQL (its SQLSTATE codes): an undefined column (42703), or a value of a text column that does not convert. */
export function postgresFault(error: { code?: string; message: string }): DataFault | undefined {
  if (error.code === '42703') {
    // column "user_id" does not exist; column e.user_id does not exist
    const named = /column "((?:[^"]|"")+)" does not exist/.exec(error.message)?.[1]?.replace(/""/g, '"') ?? /column (?:\S+\.)?(\S+) does not exist/.exec(error.message)?.[1];
    return named ? { kind: 'missing-column', column: named } : undefined;
  }
  // 22P02 invalid_text_representation, 22007 invalid_datetime_format, 22008 datetime_field_overflow
  if (error.code === '22P02' || error.code === '22007' || error.code === '22008') {
    const value = /: "(.*)"$/.exec(error.message)?.[1];
    return { kind: 'bad-value', ...(value !== undefined ? { value } : {}) };
  }
  return undefined;
}
