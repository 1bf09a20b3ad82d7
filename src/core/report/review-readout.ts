import type { PlanReadout, PlanReview } from '../review/build-review.js';
import { armCells, metricDifference, primaryClassText, VERDICT_LABEL } from './readout-figures.js';
import { metricTitle, table } from './readout-markdown.js';
import { codeSpan, safeText } from './markdown-safe.js';

/**
 * The readout part of a plan's section in the review: the registered rule applied to the recorded
 * totals, said in one line beside what the change records, then the primary's figures; and an
 * override, which is the one decision the rule did not make, for the top of the comment.
 */

interface Style {
  /** Untrusted text (a decision, a reason, an arm name) made safe where it lands. */
  escape: (text: string) => string;
  strong: (text: string) => string;
  /** A plan id or file name. */
  code: (text: string) => string;
}

export const MARKDOWN_STYLE: Style = { escape: safeText, strong: (t) => `**${t}**`, code: codeSpan };

function classLabel(c: string): string {
  return (VERDICT_LABEL as Record<string, string>)[c] ?? c;
}

/** "Rule applied: win: «Ship.». This change does that." or "… This change records flat instead." */
export function ruleAppliedLine(r: PlanReadout, style: Style): string {
  // Arms are named only when there is a choice between treatments, as the readout does.
  const arms = r.arms.length && (r.primary?.arms.length ?? 0) > 1 ? ` (${r.arms.map(style.escape).join(', ')})` : '';
  const quote = r.decision !== undefined ? `: «${style.escape(r.decision)}»` : r.verdict === 'not-read' ? '' : ' (the plan registers no decision for this)';
  const verdict = r.recorded === undefined ? 'This change records no class.' : r.recorded === r.verdict ? 'This change does that.' : `This change records ${style.strong(classLabel(r.recorded))} instead.`;
  return `Rule applied: ${style.strong(VERDICT_LABEL[r.verdict])}${arms}${quote}. ${verdict}`;
}

/** The readout block of a plan's Markdown section; empty when the plan has no readout attached. */
export function readoutSectionMarkdown(plan: PlanReview): string[] {
  const r = plan.readout;
  if (!r) return [];
  const lines = ['', ruleAppliedLine(r, MARKDOWN_STYLE), '', `<sub>Read from ${codeSpan(r.file)}.</sub>`];
  if (!r.primary) return [...lines, '', 'Metrics are withheld: with a sample ratio mismatch no difference between the arms can be trusted.'];
  const p = r.primary;
  lines.push('', metricTitle(p, 'Primary'), '', ...table(['arm', 'control', 'treatment', 'difference [CI]', 'relative [CI]', 'p', 'adjusted p', 'class'], p.arms.map((a) => [...armCells(p, a), primaryClassText(a)])));
  if (p.minDetectableEffect !== undefined) lines.push('', `Minimum detectable effect: ±${metricDifference(p, p.minDetectableEffect).replace(/^\+/, '')}.`);
  return lines;
}

/** One override line per plan that records one, for the top of the comment. */
export function overrideLines(plans: readonly PlanReview[], style: Style = MARKDOWN_STYLE): string[] {
  return plans.flatMap((plan) => {
    const o = plan.override;
    if (!o) return [];
    const rule = plan.readout ? ` where the rule gives ${style.strong(classLabel(plan.readout.verdict))}` : '';
    const acted = o.class ? `acts on ${style.strong(classLabel(o.class))}${rule}` : `departs from the rule${rule}`;
    const ship = o.ship?.length ? `, shipping ${o.ship.map(style.escape).join(', ')}` : '';
    return [`${style.strong('Override to judge')}: ${style.code(plan.id)} ${acted}${ship}. Reason given: «${style.escape(o.reason)}»`];
  });
}

export type { Style as ReadoutStyle };
