import type { Problem } from '../source/problem.js';
import { ROW_COLUMNS, type RowColumn } from './build-query.js';

/**
 * The query's result saved as CSV by any engine's client (RFC 4180: a header row, fields quoted with
 * double quotes when they hold a comma, a quote or a line break, "" for a quote inside). An empty
 * unquoted field, NULL and \N are NULL: the three ways engines export it.
 */

export interface RowCell {
  value: string | null;
  line: number;
  column: number;
}
export type ResultRow = { line: number } & Record<RowColumn, RowCell>;

/** A result is a few hundred rows; 16 MiB is far past any plan's. */
export const ROWS_MAX_BYTES = 16 * 1024 * 1024;

function problem(file: string, line: number, column: number, field: string, message: string, expected: string): Problem {
  return { severity: 'error', code: 'rows/invalid', file, line, column, field, message, expected };
}

interface Field {
  text: string;
  quoted: boolean;
  line: number;
  column: number;
}

/** Splits CSV text into records of fields with their positions; an unterminated quote is a problem. */
function splitCsv(text: string, file: string): { ok: true; records: Field[][] } | { ok: false; problem: Problem } {
  const records: Field[][] = [];
  let record: Field[] = [];
  let line = 1;
  let column = 1;
  let i = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const atRecordEnd = () => i >= text.length || text[i] === '\n' || text[i] === '\r';
  while (i < text.length) {
    const start = { line, column };
    let value = '';
    let quoted = false;
    if (text[i] === '"') {
      quoted = true;
      i++;
      column++;
      for (;;) {
        if (i >= text.length) return { ok: false, problem: problem(file, start.line, start.column, '', 'a quoted field is never closed', 'a closing double quote') };
        const ch = text[i]!;
        if (ch === '"') {
          if (text[i + 1] === '"') {
            value += '"';
            i += 2;
            column += 2;
            continue;
          }
          i++;
          column++;
          break;
        }
        value += ch;
        i++;
        if (ch === '\n') {
          line++;
          column = 1;
        } else column++;
      }
      if (!atRecordEnd() && text[i] !== ',') return { ok: false, problem: problem(file, line, column, '', 'text after a closing quote', 'a comma or the end of the line after a quoted field') };
    } else {
      while (!atRecordEnd() && text[i] !== ',') {
        value += text[i];
        i++;
        column++;
      }
    }
    record.push({ text: value, quoted, ...start });
    if (text[i] === ',') {
      i++;
      column++;
      if (atRecordEnd()) record.push({ text: '', quoted: false, line, column });
      else continue;
    }
    if (text[i] === '\r') i++;
    if (text[i] === '\n') i++;
    records.push(record);
    record = [];
    line++;
    column = 1;
  }
  return { ok: true, records: records.filter((r) => !(r.length === 1 && r[0]!.text === '' && !r[0]!.quoted)) };
}

/** CSV text -> rows keyed by the contract's columns (extra columns after them are ignored), or the problems. */
export function parseResultRows(text: string, file: string): { ok: true; rows: ResultRow[] } | { ok: false; problems: Problem[] } {
  if (text.length > ROWS_MAX_BYTES) return { ok: false, problems: [problem(file, 1, 1, '', `the file is larger than ${ROWS_MAX_BYTES / 1024 / 1024} MiB`, 'the result of the totals query: a few hundred rows')] };
  const split = splitCsv(text, file);
  if (!split.ok) return { ok: false, problems: [split.problem] };
  const [header, ...records] = split.records;
  if (!header) return { ok: false, problems: [problem(file, 1, 1, '', 'the file is empty', `a header row: ${ROW_COLUMNS.join(',')}`)] };
  const problems: Problem[] = [];
  ROW_COLUMNS.forEach((name, i) => {
    const cell = header[i];
    if (cell?.text.trim().toLowerCase() !== name) {
      problems.push(problem(file, cell?.line ?? header[0]!.line, cell?.column ?? 1, '', `column ${i + 1} of the header is ${cell ? JSON.stringify(cell.text) : 'missing'}, not ${name}`, `the header ${ROW_COLUMNS.join(',')} (in this order; more columns may follow)`));
    }
  });
  if (problems.length) return { ok: false, problems: problems.slice(0, 1) };
  const rows: ResultRow[] = [];
  for (const record of records) {
    if (record.length < ROW_COLUMNS.length) {
      const last = record[record.length - 1]!;
      problems.push(problem(file, record[0]!.line, last.column, '', `the row has ${record.length} fields, fewer than the header's ${ROW_COLUMNS.length}`, 'a field for every column (empty for NULL)'));
      continue;
    }
    const row = { line: record[0]!.line } as ResultRow;
    ROW_COLUMNS.forEach((name, i) => {
      const f = record[i]!;
      const isNull = !f.quoted && (f.text === '' || f.text === 'NULL' || f.text === '\\N');
      row[name] = { value: isNull ? null : f.text, line: f.line, column: f.column };
    });
    rows.push(row);
  }
  return problems.length ? { ok: false, problems } : { ok: true, rows };
}

/** An engine's result (columns and text values) as rows; `source` names it in errors (e.g. "DuckDB result"). */
export function rowsFromResult(result: { columns: string[]; rows: (string | null)[][] }, source: string): { ok: true; rows: ResultRow[] } | { ok: false; problems: Problem[] } {
  const wrong = ROW_COLUMNS.findIndex((name, i) => result.columns[i]?.toLowerCase() !== name);
  if (wrong >= 0) return { ok: false, problems: [problem(source, 1, wrong + 1, '', `column ${wrong + 1} is ${JSON.stringify(result.columns[wrong] ?? '')}, not ${ROW_COLUMNS[wrong]}`, `the columns ${ROW_COLUMNS.join(', ')}`)] };
  return {
    ok: true,
    rows: result.rows.map((values, r) => {
      const line = r + 2;
      const row = { line } as ResultRow;
      ROW_COLUMNS.forEach((name, i) => (row[name] = { value: values[i] ?? null, line, column: i + 1 }));
      return row;
    }),
  };
}
