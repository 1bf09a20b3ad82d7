import { Document, isMap, isScalar, isSeq, parseDocument, type Node, type YAMLMap } from 'yaml';
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
 * Writes (or rewrites) the `outcome` block of a plan's text from a readout. yaml's Document API
 * finds the existing block and builds the new one; only that block's text is replaced (or the
 * block is appended), so every other byte of the plan (comments, blank lines, key order, flow
 * style) stays exactly as it was. An `override` a person wrote is kept: it is their decision.
 */
export function recordOutcome(planText: string, readout: Readout, request: RecordRequest): RecordResult {
  if (readout.verdict === 'not-read') return { ok: false, reason: 'a readout with a sample ratio mismatch has no outcome to record: find the cause first' };
  const doc = parseDocument(planText);
  if (doc.errors.length || !isMap(doc.contents)) return { ok: false, reason: 'the plan is not a YAML mapping that can be edited' };
  const existing = doc.contents.items.find((pair) => isScalar(pair.key) && pair.key.value === 'outcome');
  // What people wrote in the block stays: an override, and a decision date and one-line reason.
  const override: unknown = doc.getIn(['outcome', 'override']);
  const date: unknown = doc.getIn(['outcome', 'date']);
  const reason: unknown = doc.getIn(['outcome', 'reason']);
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
    ...(date !== undefined ? { date } : {}),
    ...(reason !== undefined ? { reason } : {}),
    ...(override !== undefined ? { override } : {}),
  };
  const block = new Document({ outcome });
  const node = block.getIn(['outcome'], true) as YAMLMap;
  // Short lists and each figure on one line keep the block small in a diff.
  const arms = node.get('arms', true);
  if (isSeq(arms)) arms.flow = true;
  const listed = node.get('figures', true);
  if (isSeq(listed)) for (const item of listed.items) if (isMap(item)) item.flow = true;
  const over = node.get('override', true);
  if (isMap(over)) over.flow = true;
  const blockText = block.toString({ lineWidth: 0, flowCollectionPadding: false });

  if (!existing) {
    const separated = planText.length === 0 || planText.endsWith('\n') ? planText : `${planText}\n`;
    return { ok: true, text: `${separated}${blockText}` };
  }
  const keyStart = (existing.key as Node).range![0];
  const lineStart = planText.lastIndexOf('\n', keyStart - 1) + 1;
  const valueEnd = (existing.value as Node | null)?.range?.[1] ?? (existing.key as Node).range![1];
  const restStart = planText.indexOf('\n', valueEnd);
  const rest = restStart === -1 ? '' : planText.slice(restStart + 1);
  return { ok: true, text: `${planText.slice(0, lineStart)}${blockText}${rest}` };
}
