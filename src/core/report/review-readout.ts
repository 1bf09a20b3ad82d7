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

/** What the change does against the rule: the class it records and the arm it keeps, each only when it does one. */
function againstRule(r: PlanReadout, style: Style): string {
  const flags = r.removes?.flags.map(style.code).join(', ');
  const said: string[] = [];
  let departs = false;
  if (r.recorded !== undefined && r.recorded !== r.verdict) {
    said.push(`This change records ${style.strong(classLabel(r.recorded))} instead.`);
    departs = true;
  }
  if (r.removes) {
    const ships = r.ships.map((a) => style.strong(style.escape(a))).join(', ');
    if (r.removes.kept === undefined) {
      said.push(`This change removes ${flags}; could not tell which arm it keeps (${style.escape(r.removes.unknown ?? 'no branch on the flag found')})${ships ? `: check that it ships ${ships}` : ''}.`);
      departs = true;
    } else if (!r.ships.includes(r.removes.kept)) {
      const rule = r.ships.length ? `the rule ships ${ships}` : 'the readout gives no result to act on';
      said.push(`This change removes ${flags} and keeps ${style.strong(style.escape(r.removes.kept))}, but ${rule}.`);
      departs = true;
    }
  }
  if (departs) return said.join(' ');
  if (r.recorded === undefined && !r.removes) return 'This change records no class.';
  return 'This change does that.';
}

/** "Rule applied: win: «Ship.». This change does that." or the mismatch: the class recorded instead, the arm kept against the rule. */
export function ruleAppliedLine(r: PlanReadout, style: Style): string {
  // Arms are named only when there is a choice between treatments, as the readout does.
  const arms = r.arms.length && (r.primary?.arms.length ?? 0) > 1 ? ` (${r.arms.map(style.escape).join(', ')})` : '';
  const quote = r.decision !== undefined ? `: «${style.escape(r.decision)}»` : r.verdict === 'not-read' ? '' : ' (the plan registers no decision for this)';
  return `Rule applied: ${style.strong(VERDICT_LABEL[r.verdict])}${arms}${quote}. ${againstRule(r, style)}`;
}

/** Which rule was applied and where the totals came from, in one line under the rule. */
export function ruleSourceLine(r: PlanReadout, style: Style): string {
  const from = r.source === 'latest' ? `Read from ${style.code(r.file)}, the latest totals of the test this change ends` : r.source === 'changed' ? `Read from ${style.code(r.file)}, in this change` : `Read from ${style.code(r.file)}, named by the recorded outcome`;
  const rule = r.rule;
  if (!rule) return `${from}.`;
  const at = style.code(rule.commit);
  switch (rule.status) {
    case 'same':
      return `${from}; the rule as registered at launch (${at}).`;
    case 'amended':
      return `${from}; the rule as amended after launch (${at}): ${rule.amendments.map((a) => `${style.escape(a.date)}, «${style.escape(a.changed)}»`).join('; ')}.`;
    case 'changed':
      return `${from}; the rule as registered at launch (${at}): the plan was changed since without an amendment (${rule.changes.map((c) => style.escape(c.field)).join(', ')}).`;
    case 'unavailable':
      return `${from}; today's plan, because the plan at ${at} cannot be read (${style.escape(rule.why)}).`;
  }
}

/** The readout block of a plan's Markdown section; empty when the plan has no readout attached. */
export function readoutSectionMarkdown(plan: PlanReview): string[] {
  const r = plan.readout;
  if (!r) return [];
  const lines = ['', ruleAppliedLine(r, MARKDOWN_STYLE), '', `<sub>${ruleSourceLine(r, MARKDOWN_STYLE)}</sub>`];
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
