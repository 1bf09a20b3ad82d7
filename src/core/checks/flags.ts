import type { Check } from '../review/context.js';

/** A flag the change touches should belong to a plan, unless the settings exempt it. */
export const flagWithoutPlan: Check = ({ touches, registry, settings, invalidPlanFiles }) => {
  // A flag whose plan does not load has a plan: that plan is reported as invalid instead.
  const planned = new Set([...registry.entries.flatMap((e) => e.flags), ...invalidPlanFiles.flatMap((f) => f.flags ?? [])]);
  const exempt = new Set(settings.exemptFlags);
  const reported = new Set<string>();
  return touches
    .filter((t) => !planned.has(t.key) && !exempt.has(t.key) && !reported.has(t.key) && reported.add(t.key))
    .map((t) => ({
      code: 'flag-without-plan',
      message: `Flag \`${t.key}\` is ${t.side === 'added' ? 'used' : 'removed'} here, but no plan names it.`,
      fix: `Write a plan for it (plumbline new ${t.key}), link one in the description, or list it under exempt-flags in the settings if it is a kill switch or an operational toggle.`,
      file: t.file,
      line: t.line,
      // A removed use is a line of the base commit.
      ...(t.side === 'removed' ? { side: 'base' as const } : {}),
    }));
};
