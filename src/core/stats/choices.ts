/**
 * The statistical choices a command line or a plan file offers, kept apart from the calculations
 * so that parsing options and plans loads no distribution code (a faster start for every command).
 */

/** Stopping boundaries for interim looks (see sequential.ts). */
export const BOUNDARY_KINDS = ['obrien-fleming-spending', 'pocock-spending', 'obrien-fleming', 'pocock'] as const;
export type BoundaryKind = (typeof BOUNDARY_KINDS)[number];

/**
 * The sample-ratio-mismatch alarm threshold. A mismatch this unlikely almost always means broken
 * assignment or logging, not chance; 0.0005 is a common choice because the test runs on every
 * readout of every experiment (common practice, no source).
 */
export const SRM_ALARM_P = 0.0005;
