import { armsToShip } from '../readout/build-readout.js';
import type { Check } from '../review/context.js';

/**
 * A recorded outcome must be what the registered rule gives on the recorded totals, and a shipped
 * arm must be one the rule names; a departure needs an override with its reason, which reviewers
 * then judge (shown as its own finding, because that is the decision to look at).
 */
export const outcomeRecorded: Check = (context) =>
  context.linked.flatMap(({ loaded, readout, ending }) => {
    const outcome = loaded.plan.outcome;
    const where = { plan: loaded.plan.id, file: loaded.file, line: loaded.line };
    const kept = ending && 'arm' in ending.kept ? ending.kept : undefined;
    // An outcome with only a reason (a test stopped without a readout) has no class to check; the arm kept still is.
    if (!outcome?.class && !(kept && readout?.readout)) return [];
    if (!readout) {
      return [{ code: 'outcome-mismatch', message: `${loaded.plan.id} records the outcome "${outcome!.class}" without the totals file it was read from.`, fix: 'Add outcome.totals (the arm-totals file) so the review can apply the rule to it, or run plumbline readout --record.', ...where }];
    }
    if (!readout.readout) {
      return outcome?.class ? [{ code: 'outcome-mismatch', message: `${loaded.plan.id}: the recorded outcome cannot be checked: ${readout.problem}.`, fix: 'Fix the totals file, then record again with plumbline readout --record.', ...where }] : [];
    }
    const read = readout.readout;
    const computed = read.verdict;
    const ships = armsToShip(read);
    const shipped = [...new Set([...(outcome?.override?.ship ?? []), ...(kept ? [kept.arm] : [])])];
    const strayArms = shipped.filter((a) => !ships.includes(a));
    const classDiffers = outcome?.class !== undefined && computed !== outcome.class;
    const departs = classDiffers || strayArms.length > 0;
    if (!departs && !outcome?.override) return [];
    const keptStray = kept && strayArms.includes(kept.arm);
    const what = classDiffers
      ? `records "${outcome!.class}" but the registered rule gives "${computed}" on ${readout.file}`
      : keptStray
        ? `: this change removes ${ending!.flags.map((k) => `\`${k}\``).join(', ')} and keeps ${kept.arm}, but the registered rule gives "${computed}" on ${readout.file}, which ${ships.length ? `ships ${ships.join(', ')}` : 'names no arm to ship'}`
        : `ships ${strayArms.join(', ')}, which the rule does not name`;
    const said = what.startsWith(':') ? what : ` ${what}`;
    if (outcome?.override) {
      return [{ code: 'outcome-override', message: `${loaded.plan.id} departs from its registered rule${departs ? (said.startsWith(':') ? said : `:${said}`) : ': an override is recorded'}. Reason given: «${outcome.override.reason}»`, fix: 'Judge the reason: an override is the one decision in this change the rule did not make.', ...where }];
    }
    const fix = keptStray
      ? `Keep the arm the rule ships (${ships.join(', ') || 'none: read the test again'}), or record outcome.override with ship: [${kept.arm}] and a reason.`
      : 'Record what the rule gives (plumbline readout --record), or add outcome.override with a reason.';
    return [{ code: 'outcome-mismatch', message: `${loaded.plan.id}${said}.`, fix, ...where }];
  });
