import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ANNOTATIONS_PER_KIND, planAnnotations } from '../../src/action/effects.js';
import type { Review } from '../../src/core/review/build-review.js';
import type { Finding } from '../../src/core/review/finding.js';

/** A review holding only what annotations read: its findings. */
const reviewOf = (findings: Finding[]) => ({ findings }) as unknown as Review;

const finding = fc.record({
  severity: fc.constantFrom('block' as const, 'warn' as const, 'note' as const),
  located: fc.boolean(),
});

describe('planAnnotations', () => {
  it('keeps every kind within GitHub’s limit and accounts for every located finding (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.array(finding, { maxLength: 80 }),
        fc.array(fc.string(), { maxLength: 3 }),
        fc.array(fc.string(), { maxLength: 2 }),
        fc.boolean(),
        (specs, notices, warnings, fails) => {
          const findings = specs.map((s, i) => ({ code: 'plan-missing', severity: s.severity, message: `m${i}`, fix: 'f', ...(s.located ? { file: `f${i}.ts`, line: 1 } : {}) }) as Finding);
          const out = planAnnotations(reviewOf(findings), { notices, warnings, ...(fails ? { closing: 'Plumbline: failed' } : {}) });
          for (const kind of ['error', 'warning', 'notice'] as const) expect(out.filter((a) => a.kind === kind).length).toBeLessThanOrEqual(ANNOTATIONS_PER_KIND);
          // The run's own lines are never dropped, and the closing error comes last.
          expect(out.filter((a) => !a.properties.title).map((a) => a.message)).toEqual([...notices, ...warnings, ...(fails ? ['Plumbline: failed'] : [])]);
          if (fails) expect(out.at(-1)!.message).toBe('Plumbline: failed');
          const annotated = out.filter((a) => a.properties.file).length;
          const more = out.find((a) => a.properties.title === 'Plumbline');
          const left = more ? Number(/^(\d+) more/.exec(more.message)![1]) : 0;
          expect(annotated + left).toBe(specs.filter((s) => s.located).length);
        },
      ),
    );
  });

  it('keeps ten errors when the job fails with ten blocking findings: nine findings, then the closing line', () => {
    const findings = Array.from({ length: 10 }, (_, i) => ({ code: 'decisions-missing', severity: 'block', message: `m${i}`, fix: 'f', file: `p${i}.yaml`, line: 1 }) as Finding);
    const out = planAnnotations(reviewOf(findings), { notices: [], warnings: [], closing: 'Plumbline: 10 blocking findings' });
    expect(out.filter((a) => a.kind === 'error')).toHaveLength(10);
    expect(out.find((a) => a.kind === 'notice')!.message).toMatch(/^1 more finding is not annotated/);
  });

  it('keeps a place among the notices for the one that counts what was left out', () => {
    const findings = Array.from({ length: 12 }, (_, i) => ({ code: 'exposure-diluted', severity: 'note', message: `m${i}`, fix: 'f', file: `p${i}.yaml`, line: 1 }) as Finding);
    const out = planAnnotations(reviewOf(findings), { notices: [], warnings: [] });
    expect(out.filter((a) => a.kind === 'notice')).toHaveLength(10);
    expect(out.at(-1)!.message).toMatch(/^3 more findings are not annotated/);
  });
});
