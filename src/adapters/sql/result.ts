/** What an engine adapter returns: the result's column names and every value as text (exact decimals) or null. */
export interface QueryResult {
  columns: string[];
  rows: (string | null)[][];
}

/** Reports the share of the query done, 0 to 1, a few times a second while it runs. */
export type QueryProgress = (fraction: number) => void;

