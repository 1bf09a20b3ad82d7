import { ExternalError } from '../../errors.js';

/** What an engine adapter returns: the result's column names and every value as text (exact decimals) or null. */
export interface QueryResult {
  columns: string[];
  rows: (string | null)[][];
}

/** Reports the share of the query done, 0 to 1, a few times a second while it runs. */
export type QueryProgress = (fraction: number) => void;

/**
 * What an engine said about the data when a query failed on it, as facts the run layer can place: a column
 * the query names that the data does not have, or a value that does not convert (with the file, line and
 * column when the engine said them; never guessed).
 */
export type DataFault =
  | { kind: 'missing-column'; column: string }
  | { kind: 'bad-value'; column?: string; value?: string; file?: string; line?: number; type?: string };

/** A query failed on the data; `fault` says how, `message` keeps the engine's first line for anything unplaced. */
export class DataFaultError extends ExternalError {
  constructor(
    message: string,
    hint: string,
    readonly fault: DataFault,
    options?: { cause?: unknown },
  ) {
    super(message, hint, options);
  }
}
