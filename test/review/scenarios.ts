import { stringify } from 'yaml';
import { BASE_COMMIT } from '../helpers/git-repo.js';

/** A plan with every hygiene item in order; scenarios change one thing at a time. */
export function cleanPlan(overrides: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    id: 'good',
    title: 'Good test',
    owners: ['@owner-one'],
    flags: ['good-flag'],
    state: 'live',
    window: { start: '2026-11-02', end: '2026-11-29' },
    hypothesis: { change: 'A clearer cart.', because: 'People hesitate at the totals.', 'expected-direction': 'increase' },
    unit: { randomization: 'user' },
    surface: { path: 'shop/cart' },
    population: { platforms: ['web'], locales: ['en-GB'], ready: { platforms: ['web'], locales: ['en-GB'] } },
    exposure: { event: 'cart_viewed' },
    metrics: {
      primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: ['order_done'] },
      guardrails: [{ name: 'errors', kind: 'proportion', baseline: { rate: 0.02 }, events: ['cart_error'], direction: 'decrease', tolerance: { relative: 0.2 } }],
    },
    design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000 },
    decisions: { win: 'Ship.', flat: 'Drop.', loss: 'Drop and study.', 'guardrail-breach': 'Stop.' },
    ...overrides,
  };
}

export const planYaml = (plan: Record<string, unknown>) => stringify(plan);

export const CART_CODE = `export function cart(client, track) {
  track('cart_viewed');
  if (client.getBooleanValue('good-flag', false)) {
    track('order_done');
  }
  track('cart_error');
}
`;

/** The same code with the flag line changed, so the change touches good-flag. */
export const CART_CODE_TOUCHED = CART_CODE.replace("getBooleanValue('good-flag', false)", "getBooleanValue('good-flag', true)");

export function baseFiles(extra: Record<string, string> = {}): Record<string, string> {
  return { 'experiments/good.yaml': planYaml(cleanPlan()), 'src/cart.ts': CART_CODE, ...extra };
}

/** A head that changes the good plan (so it is linked) and touches its flag. */
export const withPlan = (plan: Record<string, unknown>, extra: Record<string, string | null> = {}) => ({ 'experiments/good.yaml': planYaml(plan), 'src/cart.ts': CART_CODE_TOUCHED, ...extra });

/**
 * Totals for the good plan through its planned end: the treatment's purchases as given (control: 6,000 of 20,000).
 * Launched at the base commit unless another plan-commit is given (only a change's files have it filled in).
 */
export const goodTotals = (bought: number, planCommit = BASE_COMMIT) =>
  `plan: good\nplan-commit: ${planCommit}\ndata-through: 2026-11-29\narms:\n  control: { units: 20000, metrics: { bought: { units-with-event: 6000 }, errors: { units-with-event: 400 } } }\n  treatment: { units: 20000, metrics: { bought: { units-with-event: ${bought} }, errors: { units-with-event: 400 } } }\n`;

/** A head that records an outcome for the good plan, read from totals with the treatment's purchases as given. */
export const recorded = (outcome: Record<string, unknown>, bought: number, plan: Record<string, unknown> = {}) =>
  withPlan(cleanPlan({ ...plan, outcome: { 'data-through': '2026-11-29', totals: 'readouts/good.totals.yaml', 'decided-by': '@owner-one', ...outcome } }), { 'readouts/good.totals.yaml': goodTotals(bought) });
