import { describe, expect, it } from 'vitest';
import { ROW_COLUMNS } from '../../src/core/totals-query/build-query.js';
import { parseResultRows } from '../../src/core/totals-query/rows-csv.js';

/** CSV as engines' clients write it (RFC 4180), with the position of every field for error messages. */
const HEADER = ROW_COLUMNS.join(',');

describe('parseResultRows', () => {
  it('reads quoted fields with commas, doubled quotes and line breaks, CRLF endings and a byte-order mark', () => {
    const text = `\uFEFF${HEADER}\r\nsegment,control,"platform: a,""b""\nc",,5,,,,,,,,,\r\n`;
    const parsed = parseResultRows(text, 'rows.csv');
    expect(parsed.ok && parsed.rows[0]!.bucket).toEqual({ value: 'platform: a,"b"\nc', line: 2, column: 17 });
    expect(parsed.ok && parsed.rows[0]!.units).toMatchObject({ value: '5', line: 3 });
  });

  it.each([
    ['NULL', null],
    ['\\N', null],
    ['', null],
    ['"NULL"', 'NULL'],
  ])('reads %j in a field as %j', (field, value) => {
    const parsed = parseResultRows(`${HEADER}\narm,control,${field},,5,,,,,,,,,\n`, 'rows.csv');
    expect(parsed.ok && parsed.rows[0]!.bucket.value).toBe(value);
  });

  it.each([
    ['a header in another order', `grain,bucket,arm${HEADER.slice('grain,arm,bucket'.length)}\n`, 1, 7, 'column 2 of the header is "bucket"'],
    ['an unterminated quote', `${HEADER}\narm,"control,,,5\n`, 2, 5, 'never closed'],
    ['a short row', `${HEADER}\narm,control,,,5\n`, 2, 15, 'fewer than the header'],
    ['an empty file', '', 1, 1, 'empty'],
  ])('reports %s at its line and column', (_name, text, line, column, message) => {
    const parsed = parseResultRows(text, 'rows.csv');
    expect(parsed.ok).toBe(false);
    expect(!parsed.ok && parsed.problems[0]).toMatchObject({ file: 'rows.csv', line, column, message: expect.stringContaining(message) });
  });
});
