import type { DataFault } from './core/totals-query/diagnose.js';

/**
 * The three kinds of error, each reported once by the entry point's single top-level catch.
 * User mistakes inside files are not errors at all: they are Problems, returned as data.
 */

/** The command line or the Action inputs are wrong. Exit code 2. */
export class UsageError extends Error {
  override readonly name = 'UsageError';
  constructor(
    message: string,
    /** How to fix it, e.g. an example of a correct call. */
    readonly hint?: string,
  ) {
    super(message);
  }
}

/** Something outside Plumbline failed (the file system, git, GitHub). Keeps its cause. */
export class ExternalError extends Error {
  override readonly name = 'ExternalError';
  constructor(
    message: string,
    readonly hint?: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
  }
}

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

export const BUG_REPORT_HINT =
  'This is a bug in Plumbline, not in your files. Please open an issue with the command you ran and the output above.';
