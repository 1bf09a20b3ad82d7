import type { MetricRead, Readout } from '../readout/build-readout.js';
import { armCells, confidenceOf, guardrailClassText, metricDifference, planSource, primaryClassText, ruleLine, srmLine, timingLine } from './readout-figures.js';
import { codeSpan, safeCell, safeText } from './markdown-safe.js';

const HEADER = ['arm', 'control', 'treatment', 'difference [CI]', 'relative [CI]', 'p', 'adjusted p'];

export function table(header: readonly string[], rows: readonly (readonly string[])[]): string[] {
  return [`| ${header.join(' | ')} |`, `| ${header.map(() => '---').join(' | ')} |`, ...rows.map((r) => `| ${r.map(safeCell).join(' | ')} |`)];
}

export function metricTitle(read: MetricRead, what: string): string {
  const segment = read.segment !== undefined ? ` in “${safeText(read.segment)}”` : '';
  const cuped = read.cuped ? `; CUPED θ ${read.cuped.theta.toPrecision(3)}, variance −${Math.round(read.cuped.varianceReduction * 100)}%` : '';
  return `**${what}: ${codeSpan(read.metric)}${segment}** (${read.kind}, ${read.direction} is better; ${confidenceOf(read)} intervals${cuped})`;
}

function sourceOf(readout: Readout): string {
  const { before, commit, after } = planSource(readout);
  return `${before}${codeSpan(commit)}${after}`;
}

/** The readout as Markdown, for a pull-request comment or a summary. */
export function renderReadoutMarkdown(readout: Readout): string {
  const rule = ruleLine(readout);
  const quote = rule.quote ? `: «${safeText(rule.quote)}»` : readout.verdict === 'not-read' ? '' : ' (the plan registers no decision for this)';
  const lines: string[] = [
    `### Readout of ${codeSpan(readout.planId)}: ${safeText(readout.title)}`,
    '',
    `Rule applied: **${rule.label}**${safeText(rule.arms)}${quote}`,
    '',
    `${timingLine(readout)} ${sourceOf(readout)}`,
  ];
  const blocking = readout.findings.filter((f) => f.severity === 'block');
  if (blocking.length) lines.push('', ...blocking.map((f) => `- :no_entry: ${safeText(f.message)}`));
  const srm = srmLine(readout);
  if (srm) lines.push('', srm);
  if (readout.verdict === 'not-read') {
    lines.push('', 'Metrics are withheld: with a sample ratio mismatch no difference between the arms can be trusted.');
    return `${lines.join('\n')}\n`;
  }
  lines.push('', metricTitle(readout.primary, 'Primary'), '', ...table([...HEADER, 'class'], readout.primary.arms.map((a) => [...armCells(readout.primary, a), primaryClassText(a)])));
  if (readout.primary.minDetectableEffect !== undefined) lines.push('', `Minimum detectable effect: ±${metricDifference(readout.primary, readout.primary.minDetectableEffect).replace(/^\+/, '')}.`);
  for (const g of readout.guardrails) {
    lines.push('', metricTitle(g, 'Guardrail (non-inferiority, one-sided)'), '', ...table([...HEADER, 'class'], g.arms.map((a) => [...armCells(g, a), guardrailClassText(a, g)])));
  }
  const exploratory = [...readout.secondary, ...readout.segments];
  if (exploratory.length) {
    lines.push('', '<details><summary>Exploratory: secondary metrics and segments (Benjamini–Hochberg across them); leads to confirm, not results</summary>');
    for (const m of exploratory) {
      lines.push('', metricTitle(m, m.role === 'segment' ? 'Segment' : 'Secondary'), '', ...table([...HEADER, 'signal'], m.arms.map((a) => [...armCells(m, a), a.exploratorySignal ? 'lead' : '—'])));
    }
    lines.push('', '</details>');
  }
  const others = readout.findings.filter((f) => f.severity !== 'block');
  if (others.length) lines.push('', ...others.map((f) => `- ${f.severity === 'warn' ? ':warning:' : ':information_source:'} ${safeText(f.message)}`));
  return `${lines.join('\n')}\n`;
}
