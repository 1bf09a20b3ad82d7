import type { MetricRead, Readout } from '../readout/build-readout.js';
import { armCells, confidenceOf, guardrailClassText, metricDifference, planSource, primaryClassText, ruleLine, srmLine, timingLine } from './readout-figures.js';
import { formatTable, terminalSafe, terminalStyle } from './terminal-style.js';

const HEADER = ['ARM', 'CONTROL', 'TREATMENT', 'DIFFERENCE [CI]', 'RELATIVE [CI]', 'P', 'ADJUSTED P'];

function metricTitle(read: MetricRead, what: string): string {
  return `${what}: ${terminalSafe(read.metric)}${read.segment !== undefined ? ` in "${terminalSafe(read.segment)}"` : ''} (${read.kind}, ${read.direction} is better; ${confidenceOf(read)} intervals${read.cuped ? `; CUPED θ ${read.cuped.theta.toPrecision(3)}, variance −${Math.round(read.cuped.varianceReduction * 100)}%` : ''})`;
}

/** The readout for a terminal: the rule applied first, then why. */
export function renderReadoutText(readout: Readout, options: { color: boolean }): string {
  const style = terminalStyle(options.color);
  const rule = ruleLine(readout);
  const colour = readout.verdict === 'win' ? style.green : readout.verdict === 'inconclusive' || readout.verdict === 'flat' ? style.yellow : style.red;
  const lines: string[] = [
    style.bold(`Readout of ${terminalSafe(readout.planId)}: ${terminalSafe(readout.title)}`),
    `${timingLine(readout)} ${((s) => `${s.before}${terminalSafe(s.commit)}${s.after}`)(planSource(readout))}`,
    '',
    `Rule applied: ${colour(style.bold(rule.label))}${terminalSafe(rule.arms)}${rule.quote ? `: «${terminalSafe(rule.quote)}»` : readout.verdict === 'not-read' ? '' : ' (the plan registers no decision for this)'}`,
  ];
  const blocking = readout.findings.filter((f) => f.severity === 'block');
  const others = readout.findings.filter((f) => f.severity !== 'block');
  if (blocking.length) lines.push('', ...blocking.map((f) => `${style.red('BLOCK')} ${terminalSafe(f.message)}`));
  const srm = srmLine(readout);
  if (srm) lines.push('', srm);
  if (readout.verdict === 'not-read') {
    lines.push('', 'Metrics are withheld: with a sample ratio mismatch no difference between the arms can be trusted.');
    return lines.join('\n');
  }
  lines.push('', style.bold(metricTitle(readout.primary, 'Primary')));
  lines.push(formatTable([...HEADER, 'CLASS'], readout.primary.arms.map((a) => [...armCells(readout.primary, a), primaryClassText(a)])));
  if (readout.primary.minDetectableEffect !== undefined) lines.push(`Minimum detectable effect: ±${metricDifference(readout.primary, readout.primary.minDetectableEffect).replace(/^\+/, '')}.`);
  for (const g of readout.guardrails) {
    lines.push('', style.bold(metricTitle(g, 'Guardrail (non-inferiority, one-sided)')));
    lines.push(formatTable([...HEADER, 'CLASS'], g.arms.map((a) => [...armCells(g, a), guardrailClassText(a, g)])));
  }
  const exploratory = [...readout.secondary, ...readout.segments];
  if (exploratory.length) {
    lines.push('', style.bold('Exploratory (secondary metrics and segments; Benjamini–Hochberg across them): leads to confirm, not results'));
    for (const m of exploratory) {
      lines.push('', metricTitle(m, m.role === 'segment' ? 'Segment' : 'Secondary'));
      lines.push(formatTable([...HEADER, 'SIGNAL'], m.arms.map((a) => [...armCells(m, a), a.exploratorySignal ? 'lead' : '—'])));
    }
  }
  if (others.length) lines.push('', ...others.map((f) => `${f.severity === 'warn' ? style.yellow('WARN') : style.dim('NOTE')}  ${terminalSafe(f.message)}`));
  return lines.join('\n');
}
