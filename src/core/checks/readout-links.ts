import type { Check, LinkedPlan } from '../review/context.js';

/**
 * What a change that ends a test, or reads one out, must show: a readout (the test's totals, or at least a
 * recorded outcome), and a rule that is the one registered at launch. The arm the change keeps against
 * the rule is checked with the recorded outcome (outcome.ts), since an override answers both.
 */

/** A test whose flag's last read the change removes, with neither totals nor a recorded outcome. */
export const endedWithoutReadout: Check = (context) =>
  context.linked.flatMap(({ loaded, ending, readout }) => {
    const { plan } = loaded;
    if (!ending || readout || plan.outcome) return [];
    // Before its planned end a started test gets test-ended-early instead: no readout could be read yet.
    const over = plan.state === 'concluded' || (plan.window.end !== undefined && plan.window.end < context.today);
    if (!over) return [];
    const flags = ending.flags.map((k) => `\`${k}\``).join(', ');
    return [
      {
        code: 'readout-missing',
        message: `This change removes the last read of ${flags}, ending ${plan.id}, without a readout: no arm totals for it were found (a readouts/ folder or a *.totals.yaml file) and its plan records no outcome.`,
        fix: `Add the test's arm totals (see docs/totals-reference.md) and run plumbline readout ${plan.id} --totals <file> --record, or record outcome: { date, reason } in ${loaded.file} when the test ended without data.`,
        plan: plan.id,
        file: loaded.file,
        line: loaded.line,
      },
    ];
  });

/** The readout's rule is not plainly the launch rule: changed since without an amendment, or the launch plan cannot be read. */
export const ruleAtLaunch: Check = (context) =>
  context.linked.flatMap(({ loaded, readout }: LinkedPlan) => {
    const rule = readout?.readout?.rule;
    if (!rule || !readout) return [];
    const where = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
    if (rule.status === 'changed') {
      return [
        {
          code: 'rule-changed',
          message: `The rule was changed after launch: ${loaded.plan.id} at the plan-commit of ${readout.file} (${rule.commit}) differs from today's plan in ${rule.changes.map((c) => `${c.field} (${c.before} → ${c.after})`).join('; ')}, and no amendment records it. The readout applies the rule as registered at launch.`,
          fix: 'Put the plan back as registered, or, if the change was decided before the data was seen, append an entry under amendments: with date, changed and reason.',
          ...where,
        },
      ];
    }
    if (rule.status === 'unavailable') {
      return [
        {
          code: 'launch-plan-unavailable',
          message: `${readout.file} names plan-commit ${rule.commit}, but the plan as registered then cannot be read: ${rule.why}. The readout uses today's plan and cannot show that it is the rule registered at launch.`,
          fix: 'Write the commit of the plan when the test launched as plan-commit (git log --format=%h -1 -- the plan file, at launch); in CI, check out with fetch-depth: 0.',
          ...where,
        },
      ];
    }
    return [];
  });
