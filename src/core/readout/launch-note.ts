import type { LaunchRule } from '../plan/launch-rule.js';
import type { Readout, ReadoutFinding } from './build-readout.js';

/** What the readout says about the rule it applied: the launch rule, an amended one, or today's for want of history. */
export type RuleSource =
  | { status: 'same'; commit: string }
  | { status: 'amended'; commit: string; changes: { field: string; before: string; after: string }[]; amendments: { date: string; changed: string; reason: string }[] }
  | { status: 'changed'; commit: string; changes: { field: string; before: string; after: string }[] }
  | { status: 'unavailable'; commit: string; why: string };

const listChanges = (changes: readonly { field: string; before: string; after: string }[]) => changes.map((c) => `${c.field} (${c.before} → ${c.after})`).join('; ');

function findingOf(rule: LaunchRule): ReadoutFinding | undefined {
  switch (rule.status) {
    case 'same':
      return undefined;
    case 'changed':
      return {
        severity: 'block',
        code: 'readout/rule-changed',
        message: `The rule was changed after launch (plan-commit ${rule.commit}) without an amendment: ${listChanges(rule.changes)}. This readout applies the rule as registered at launch; a rule changed after the data came in lets the result be chosen.`,
      };
    case 'amended':
      return {
        severity: 'note',
        code: 'readout/rule-amended',
        message: `The plan was amended after launch (plan-commit ${rule.commit}): ${rule.amendments.map((a) => `on ${a.date}, “${a.changed}” because “${a.reason}”`).join('; ')}. This readout applies the amended rule (${listChanges(rule.changes)}).`,
      };
    case 'unavailable':
      return {
        severity: 'warn',
        code: 'readout/launch-plan-unavailable',
        message: `The plan as registered at launch cannot be read: ${rule.why}. This readout uses today's plan, which may not be the rule registered at launch.`,
      };
  }
}

/** The readout with the rule's source recorded, and a finding when the rule is not plainly the launch rule. */
export function withLaunchRule(readout: Readout, rule: LaunchRule): Readout {
  const source: RuleSource =
    rule.status === 'same'
      ? { status: 'same', commit: rule.commit }
      : rule.status === 'unavailable'
        ? { status: 'unavailable', commit: rule.commit, why: rule.why }
        : rule.status === 'amended'
          ? { status: 'amended', commit: rule.commit, changes: rule.changes, amendments: rule.amendments }
          : { status: 'changed', commit: rule.commit, changes: rule.changes };
  const finding = findingOf(rule);
  return { ...readout, rule: source, findings: finding ? [finding, ...readout.findings] : readout.findings };
}
