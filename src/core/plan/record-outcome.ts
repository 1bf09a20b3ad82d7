import { isMap, parseDocument, type YAMLMap } from 'yaml';
import type { Readout } from '../readout/build-readout.js';
import type { OutcomeClass } from './outcome.js';

export interface RecordRequest {
  decidedBy: string;
  /** The totals file read, relative to the repository. */
  totalsFile: string;
  /** The day of recording, YYYY-MM-DD (the caller owns the clock). */
  recordedOn: string;
}

export type RecordResult = { ok: true; text: string } | { ok: false; reason: string };

/** Significant digits kept in the recorded figures: enough to compare, short enough to review. */
const DIGITS = 6;
const round = (x: number) => Number(x.toPrecision(DIGITS));

/**
 * Writes (or rewrites) the `outcome` block of a plan's text from a readout, through yaml's Document
 * API so that every comment, blank line and key order of the rest of the plan stays as it was. An
 * `override` a person wrote is kept: it is their decision, not the computation's.
 */
export function recordOutcome(planText: string, readout: Readout, request: RecordRequest): RecordResult {
  if (readout.verdict === 'not-read') return { ok: false, reason: 'a readout with a sample ratio mismatch has no outcome to record: find the cause first' };
  const doc = parseDocument(planText, { keepSourceTokens: false });
  if (doc.errors.length || !isMap(doc.contents)) return { ok: false, reason: 'the plan is not a YAML mapping that can be edited' };
  const previous = doc.getIn(['outcome', 'override'], true);
  const figures = readout.primary.arms.flatMap((a) => {
    const c = a.comparison;
    if (!c) return [];
    return [
      {
        arm: a.arm,
        metric: readout.primary.metric,
        difference: round(c.difference),
        low: round(c.interval.low),
        high: round(c.interval.high),
        ...(c.relative ? { relative: round(c.relative.value) } : {}),
        'p-value': round(a.adjustedP ?? c.pValue),
      },
    ];
  });
  const outcome = {
    class: readout.verdict as OutcomeClass,
    arms: readout.verdictArms,
    'data-through': readout.dataThrough,
    totals: request.totalsFile,
    ...(readout.timing.readEarly ? { 'read-early': true } : {}),
    figures,
    'decided-by': request.decidedBy,
    'recorded-on': request.recordedOn,
  };
  const node = doc.createNode(outcome) as YAMLMap;
  // Short lists and each figure on one line keep the block small in a diff.
  for (const key of ['arms', 'figures']) {
    const list = node.get(key, true) as { flow?: boolean; items?: { flow?: boolean }[] } | undefined;
    if (key === 'arms' && list) list.flow = true;
    if (key === 'figures') for (const item of list?.items ?? []) item.flow = true;
  }
  if (previous) node.set('override', previous);
  doc.setIn(['outcome'], node);
  const text = doc.toString({ lineWidth: 0 });
  return { ok: true, text };
}
