import { loadPlan } from '../../src/core/plan/load.js';
import type { Plan } from '../../src/core/plan/schema.js';
import { loadTotals } from '../../src/core/totals/load.js';
import type { ArmTotalsFile } from '../../src/core/totals/schema.js';

/** A small plan for readout tests; `design` and `extra` lines replace or add to the defaults. */
export function planText(options: { design?: string; window?: string; extra?: string } = {}): string {
  return `id: wallet-test
title: Wallets first
owners: ["@ana-lima"]
flags: [wallet-first]
state: live
window: ${options.window ?? '{ start: 2026-11-02, end: 2026-11-29 }'}
hypothesis: { change: Wallets first., because: Faster., expected-direction: increase }
unit: { randomization: user }
surface: { path: checkout/payment }
metrics:
  primary: { name: conv, kind: proportion, baseline: { rate: 0.1 }, events: [order_placed] }
  guardrails:
    - { name: errors, kind: proportion, baseline: { rate: 0.02 }, events: [payment_error], direction: decrease, tolerance: { absolute: 0.004 } }
  secondary:
    - { name: spend, kind: mean, baseline: { mean: 20, sd: 10 }, events: [order_placed] }
design: ${options.design ?? '{ min-detectable-effect: { relative: 0.05 }, daily-units: 4000 }'}
decisions: { win: Ship wallets first., flat: Keep the card form., loss: Revert., guardrail-breach: Roll back now. }
${options.extra ?? ''}`;
}

export function plan(options: Parameters<typeof planText>[0] = {}): Plan {
  const loaded = loadPlan(planText(options), 'experiments/wallet-test.yaml');
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.loaded.plan;
}

export interface ArmNumbers {
  units: number;
  conv: number;
  errors?: number;
  extra?: string;
}

export function totalsText(arms: Record<string, ArmNumbers>, dataThrough = '2026-11-29'): string {
  const lines = ['plan: wallet-test', 'plan-commit: 4b1d2e7', `data-through: ${dataThrough}`, 'arms:'];
  for (const [arm, a] of Object.entries(arms)) {
    lines.push(`  ${arm}:`, `    units: ${a.units}`, '    metrics:', `      conv: { units-with-event: ${a.conv} }`);
    if (a.errors !== undefined) lines.push(`      errors: { units-with-event: ${a.errors} }`);
    if (a.extra) lines.push(a.extra);
  }
  return `${lines.join('\n')}\n`;
}

export function totals(text: string, against?: Plan): ArmTotalsFile {
  const loaded = loadTotals(text, 'readouts/wallet-test.totals.yaml', against);
  if (!loaded.ok) throw new Error(JSON.stringify(loaded.errors));
  return loaded.totals;
}
