import type { Check } from '../review/context.js';

/**
 * A recorded outcome must be what the registered rule gives on the recorded totals, and a shipped
 * arm must be one the rule names; a departure needs an override with its reason, which reviewers
 * then judge (shown as its own finding, because that is the decision to look at).
 */
export const outcomeRecorded: Check = (context) =>
  context.linked.flatMap(({ loaded, readout }) => {
    const outcome = loaded.plan.outcome;
    // An outcome with only a reason (a test stopped without a readout) has no class to check.
    if (!outcome?.class) return [];
    const where = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
    if (!readout) {
      return [{ code: 'outcome-mismatch', message: `${loaded.plan.id} records the outcome "${outcome.class}" without the totals file it was read from.`, fix: 'Add outcome.totals (the arm-totals file) so the review can apply the rule to it, or run plumbline readout --record.', ...where }];
    }
    if (!readout.readout) return [{ code: 'outcome-mismatch', message: `${loaded.plan.id}: the recorded outcome cannot be checked: ${readout.problem}.`, fix: 'Fix the totals file, then record again with plumbline readout --record.', ...where }];
    const computed = readout.readout.verdict;
    const named = readout.readout.verdictArms;
    const shipped = outcome.override?.ship ?? [];
    const strayArms = computed === 'win' ? shipped.filter((a) => !named.includes(a)) : shipped;
    const departs = computed !== outcome.class || strayArms.length > 0;
    if (!departs && !outcome.override) return [];
    const what = computed !== outcome.class ? `records "${outcome.class}" but the registered rule gives "${computed}" on ${readout.file}` : `ships ${strayArms.join(', ')}, which the rule does not name`;
    if (outcome.override) {
      return [{ code: 'outcome-override', message: `${loaded.plan.id} departs from its registered rule: ${departs ? what : 'an override is recorded'}. Reason given: «${outcome.override.reason}»`, fix: 'Judge the reason: an override is the one decision in this change the rule did not make.', ...where }];
    }
    return [{ code: 'outcome-mismatch', message: `${loaded.plan.id} ${what}.`, fix: 'Record what the rule gives (plumbline readout --record), or add outcome.override with a reason.', ...where }];
  });
