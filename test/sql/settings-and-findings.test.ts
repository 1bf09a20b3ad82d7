import { describe, expect, it } from 'vitest';
import { loadSettings } from '../../src/core/config/load.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { buildReadout, SEVERAL_ARMS_BLOCK_SHARE } from '../../src/core/readout/build-readout.js';
import { plan, totals, totalsText } from '../readout/fixtures.js';
import { SHAPES_PLAN } from './fixtures.js';

/** The settings' data block, the plan's per-unit key and the readout's finding on units left out. */

describe('data settings', () => {
  it('defaults every column to the contract’s names and filters on the experiment column', () => {
    const loaded = loadSettings('data:\n  exposures: { table: analytics.exposures }\n', '.plumbline.yml');
    expect(loaded.ok && loaded.settings.data).toMatchObject({
      exposures: { source: { table: 'analytics.exposures' }, columns: { unitId: 'unit_id', arm: 'arm', exposedAt: 'exposed_at', experiment: 'experiment' }, segments: [] },
      events: { columns: { unitId: 'unit_id', event: 'event', occurredAt: 'occurred_at', value: 'value' } },
      duckdb: { memoryLimit: '1.5GiB' },
    });
    const off = loadSettings('data:\n  exposures: { experiment: false }\n', '.plumbline.yml');
    expect(off.ok && off.settings.data.exposures.columns).not.toHaveProperty('experiment');
  });

  it.each([
    ['both a table and files', 'data:\n  events:\n    table: a\n    files: b.csv\n', 3, 'data.events', 'either table or files'],
    ['a memory limit without a unit', 'data:\n  duckdb: { memory-limit: 2 }\n', 2, 'data.duckdb.memory-limit', 'an amount of memory'],
    ['a column name with a line break', 'data:\n  exposures: { arm: "a\\nb" }\n', 2, 'data.exposures.arm', 'without control characters'],
    ['pre-period days of 0', 'data:\n  pre-period-days: 0\n', 2, 'data.pre-period-days', 'from 1 to 365'],
  ])('rejects %s at its line and field', (_name, text, line, field, expected) => {
    const loaded = loadSettings(text, '.plumbline.yml');
    expect(loaded.ok).toBe(false);
    expect(!loaded.ok && loaded.errors[0]).toMatchObject({ file: '.plumbline.yml', line, field, expected: expect.stringContaining(expected) });
  });
});

describe('per-unit in a plan', () => {
  it('names the file, line and field of an event the metric does not list', () => {
    const text = SHAPES_PLAN.replace('per-unit: { counts: without-event, events: [order_placed], among: [basket_viewed] }', 'per-unit: { counts: without-event, events: [order_placed], among: [basket_opened] }');
    const loaded = loadPlan(text, 'experiments/basket-shapes.yaml');
    expect(loaded.ok).toBe(false);
    const line = text.split('\n').findIndex((l) => l.includes('basket_opened')) + 1;
    expect(!loaded.ok && loaded.errors[0]).toMatchObject({ code: 'plan/per-unit-event', file: 'experiments/basket-shapes.yaml', line, field: 'metrics.guardrails[0].per-unit.among[0]' });
  });

  it('rejects a key of another kind (value on a proportion) with the closest known key', () => {
    const loaded = loadPlan(SHAPES_PLAN.replace('per-unit: { counts: without-event,', 'per-unit: { value: count, counts: without-event,'), 'p.yaml');
    expect(loaded.ok).toBe(false);
    expect(!loaded.ok && loaded.errors[0]!.field).toContain('per-unit');
  });

  it('warns about a ratio of three events that does not say which is which', () => {
    const loaded = loadPlan(SHAPES_PLAN.replace('events: [order_placed, basket_viewed]\n      per-unit: { numerator: { value: count }, denominator: { value: count } }', 'events: [order_placed, basket_viewed, other_event]'), 'p.yaml');
    expect(loaded.ok && loaded.warnings.map((w) => w.code)).toContain('plan/per-unit-ambiguous');
  });
});

describe('units left out, in the readout', () => {
  const base = { control: { units: 10_000, conv: 1000, errors: 200 }, treatment: { units: 10_000, conv: 1050, errors: 200 } };
  const withExcluded = (several: number, unknown = 0) => totals(`${totalsText(base)}excluded: { several-arms: ${several}, unknown-arm: ${unknown} }\n`, plan());

  it('warns when a few units were in several arms, and blocks above the threshold, saying it breaks randomization', () => {
    const few = buildReadout(plan(), withExcluded(50)).findings.find((f) => f.code === 'readout/units-in-several-arms');
    expect(few).toMatchObject({ severity: 'warn', message: expect.stringContaining('breaks randomization') });
    const many = Math.ceil(20_000 * SEVERAL_ARMS_BLOCK_SHARE * 1.1);
    expect(buildReadout(plan(), withExcluded(many)).findings.find((f) => f.code === 'readout/units-in-several-arms')?.severity).toBe('block');
  });

  it('says nothing when none were left out, and warns about unknown arms', () => {
    expect(buildReadout(plan(), withExcluded(0)).findings.map((f) => f.code)).not.toContain('readout/units-in-several-arms');
    expect(buildReadout(plan(), withExcluded(0, 3)).findings.find((f) => f.code === 'readout/unknown-arm')?.severity).toBe('warn');
  });
});

describe('per-unit and a running test', () => {
  it('is one of the fields that decide the result: changing it after the start shows as a change', async () => {
    const { changedFields, decisiveFields } = await import('../../src/core/plan/compare.js');
    const before = loadPlan(SHAPES_PLAN, 'p.yaml');
    const after = loadPlan(SHAPES_PLAN.replace('among: [basket_viewed] }', 'among: [basket_viewed], within-days: 7 }'), 'p.yaml');
    if (!before.ok || !after.ok) throw new Error('plans do not load');
    const changes = changedFields(decisiveFields(before.loaded.plan, true), decisiveFields(after.loaded.plan, true));
    expect(changes.map((c) => c.field)).toEqual(['metrics.guardrails[abandonment].per-unit']);
  });
});
