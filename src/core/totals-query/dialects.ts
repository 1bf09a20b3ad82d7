/**
 * What differs between the SQL engines the totals query is written for. Everything else in the query
 * is the common subset (CTEs, GROUP BY, CASE, window functions, UNION ALL); docs/totals-from-sql.md lists
 * each difference handled here and why.
 *
 * Every name that reaches SQL goes through `identifier` and every text through `string`: plan and
 * settings text is never concatenated into the query unquoted.
 */

export const DIALECTS = ['duckdb', 'postgres', 'trino', 'bigquery', 'snowflake', 'spark'] as const;
export type DialectName = (typeof DIALECTS)[number];

export interface Dialect {
  name: DialectName;
  /** One name part, quoted. */
  identifier(name: string): string;
  /** A text literal. */
  string(text: string): string;
  /** The instant at 00:00 UTC of a calendar day (YYYY-MM-DD, already validated). */
  midnightUtc(day: string): string;
  /** An expression read as a timestamp with time zone (a plain timestamp is read in the session's zone: UTC). */
  instant(expression: string): string;
  /** The UTC calendar day of an instant, as text YYYY-MM-DD. */
  utcDay(expression: string): string;
  /** An instant moved by a whole number of hours (hours, not days: a day interval follows daylight saving in some engines). */
  addHours(expression: string, hours: number): string;
  /** A value cast to the fixed-point type values are summed in (scale 6). */
  value(expression: string): string;
  /** A sum cast to the fixed-point type the result carries (scale 12: squares of scale-6 values stay exact). */
  wide(expression: string): string;
  text(expression: string): string;
  integer(expression: string): string;
}

/** Doubles every occurrence of `quote` (the SQL standard's escape inside quotes). */
const doubled = (quote: string) => (text: string) => `${quote}${text.split(quote).join(quote + quote)}${quote}`;

/** Backslash escapes, for engines whose string literals read them (BigQuery, Spark, Snowflake). */
function backslashed(text: string, quote: string, doubleQuote: boolean): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (ch === '\\') out += '\\\\';
    else if (ch === quote) out += doubleQuote ? quote + quote : `\\${quote}`;
    else if (code < 0x20 || code === 0x7f) out += `\\u${code.toString(16).padStart(4, '0')}`;
    else out += ch;
  }
  return `${quote}${out}${quote}`;
}

const ansiIdentifier = doubled('"');
const ansiString = doubled("'");

const duckdb: Dialect = {
  name: 'duckdb',
  identifier: ansiIdentifier,
  string: ansiString,
  midnightUtc: (day) => `CAST(${ansiString(`${day} 00:00:00+00`)} AS TIMESTAMPTZ)`,
  instant: (e) => `CAST(${e} AS TIMESTAMPTZ)`,
  utcDay: (e) => `STRFTIME(TIMEZONE('UTC', ${e}), '%Y-%m-%d')`,
  addHours: (e, h) => `(${e} ${h < 0 ? '-' : '+'} INTERVAL '${Math.abs(h)} hours')`,
  value: (e) => `CAST(${e} AS DECIMAL(38, 6))`,
  wide: (e) => `CAST(${e} AS DECIMAL(38, 12))`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  integer: (e) => `CAST(${e} AS BIGINT)`,
};

const postgres: Dialect = {
  name: 'postgres',
  identifier: ansiIdentifier,
  // With standard_conforming_strings off a backslash would escape; E'' reads it the same either way.
  string: (text) => (text.includes('\\') ? `E${backslashed(text, "'", true)}` : ansiString(text)),
  midnightUtc: (day) => `CAST(${ansiString(`${day} 00:00:00+00`)} AS TIMESTAMPTZ)`,
  instant: (e) => `CAST(${e} AS TIMESTAMPTZ)`,
  utcDay: (e) => `TO_CHAR(${e} AT TIME ZONE 'UTC', 'YYYY-MM-DD')`,
  addHours: (e, h) => `(${e} ${h < 0 ? '-' : '+'} INTERVAL '${Math.abs(h)} hours')`,
  value: (e) => `CAST(${e} AS NUMERIC(38, 6))`,
  wide: (e) => `CAST(${e} AS NUMERIC(38, 12))`,
  text: (e) => `CAST(${e} AS TEXT)`,
  integer: (e) => `CAST(${e} AS BIGINT)`,
};

const trino: Dialect = {
  name: 'trino',
  identifier: ansiIdentifier,
  string: ansiString,
  midnightUtc: (day) => `CAST(${ansiString(`${day} 00:00:00 UTC`)} AS TIMESTAMP(6) WITH TIME ZONE)`,
  instant: (e) => `CAST(${e} AS TIMESTAMP(6) WITH TIME ZONE)`,
  utcDay: (e) => `DATE_FORMAT(AT_TIMEZONE(${e}, 'UTC'), '%Y-%m-%d')`,
  addHours: (e, h) => `DATE_ADD('hour', ${h}, ${e})`,
  value: (e) => `CAST(${e} AS DECIMAL(38, 6))`,
  wide: (e) => `CAST(${e} AS DECIMAL(38, 12))`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  integer: (e) => `CAST(${e} AS BIGINT)`,
};

const bigquery: Dialect = {
  name: 'bigquery',
  identifier: (name) => backslashed(name, '`', false),
  string: (text) => backslashed(text, "'", false),
  midnightUtc: (day) => `TIMESTAMP(${backslashed(`${day} 00:00:00+00`, "'", false)})`,
  instant: (e) => `CAST(${e} AS TIMESTAMP)`,
  utcDay: (e) => `FORMAT_TIMESTAMP('%Y-%m-%d', ${e}, 'UTC')`,
  addHours: (e, h) => `TIMESTAMP_ADD(${e}, INTERVAL ${h} HOUR)`,
  // NUMERIC holds 29 digits before the point and 9 after: values rounded to 6 decimals as elsewhere; a
  // square of a value with more than 4 decimals is rounded at the 9th (docs/totals-from-sql.md).
  value: (e) => `ROUND(CAST(${e} AS NUMERIC), 6)`,
  wide: (e) => `CAST(${e} AS NUMERIC)`,
  text: (e) => `CAST(${e} AS STRING)`,
  integer: (e) => `CAST(${e} AS INT64)`,
};

const snowflake: Dialect = {
  name: 'snowflake',
  identifier: ansiIdentifier,
  string: (text) => backslashed(text, "'", true),
  midnightUtc: (day) => `TO_TIMESTAMP_TZ('${day} 00:00:00 +00:00')`,
  instant: (e) => `CAST(${e} AS TIMESTAMP_TZ)`,
  utcDay: (e) => `TO_CHAR(CONVERT_TIMEZONE('UTC', ${e}), 'YYYY-MM-DD')`,
  addHours: (e, h) => `DATEADD(hour, ${h}, ${e})`,
  value: (e) => `CAST(${e} AS NUMBER(38, 6))`,
  wide: (e) => `CAST(${e} AS NUMBER(38, 12))`,
  text: (e) => `CAST(${e} AS VARCHAR)`,
  integer: (e) => `CAST(${e} AS BIGINT)`,
};

const spark: Dialect = {
  name: 'spark',
  identifier: doubled('`'),
  string: (text) => backslashed(text, "'", false),
  midnightUtc: (day) => `CAST('${day} 00:00:00Z' AS TIMESTAMP)`,
  instant: (e) => `CAST(${e} AS TIMESTAMP)`,
  utcDay: (e) => `DATE_FORMAT(TO_UTC_TIMESTAMP(${e}, CURRENT_TIMEZONE()), 'yyyy-MM-dd')`,
  addHours: (e, h) => `TIMESTAMP_MICROS(UNIX_MICROS(${e}) + ${h * 3_600_000_000})`,
  value: (e) => `CAST(${e} AS DECIMAL(38, 6))`,
  wide: (e) => `CAST(${e} AS DECIMAL(38, 12))`,
  text: (e) => `CAST(${e} AS STRING)`,
  integer: (e) => `CAST(${e} AS BIGINT)`,
};

export const DIALECT: Readonly<Record<DialectName, Dialect>> = { duckdb, postgres, trino, bigquery, snowflake, spark };

/** A table name with dots between its parts (catalog.schema.table), each part quoted. */
export function tableName(dialect: Dialect, name: string): string {
  return name
    .split('.')
    .map((part) => dialect.identifier(part.trim()))
    .join('.');
}
