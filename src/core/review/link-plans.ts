import type { LoadedPlan } from '../plan/load.js';
import type { FlagTouch } from '../scan/flag-touches.js';
import type { LinkReason, PullRequestInfo } from './context.js';

/**
 * Which plans a change is about: plans named in the pull request's description (by id or path),
 * plan files the change adds or edits, and plans whose flags the change touches.
 */
export function linkPlans(options: {
  plans: readonly LoadedPlan[];
  changedPaths: ReadonlySet<string>;
  touches: readonly FlagTouch[];
  pr: PullRequestInfo;
}): Map<string, LinkReason[]> {
  const links = new Map<string, LinkReason[]>();
  const add = (id: string, reason: LinkReason) => {
    const reasons = links.get(id) ?? [];
    if (!reasons.includes(reason)) reasons.push(reason);
    links.set(id, reasons);
  };
  const body = options.pr.body ?? '';
  const touched = new Set(options.touches.map((t) => t.key));
  for (const { plan, file } of options.plans) {
    // An id counts only as a whole word: "checkout" must not link "checkout-wallet".
    const idPattern = new RegExp(`(?<![\\w/-])${plan.id.replace(/[-]/g, '\\-')}(?![\\w-])`);
    if (body.includes(file) || idPattern.test(body)) add(plan.id, 'named in the description');
    if (options.changedPaths.has(file)) add(plan.id, 'plan file changed');
    if (plan.flags.some((f) => touched.has(f))) add(plan.id, 'flag touched');
  }
  return links;
}
