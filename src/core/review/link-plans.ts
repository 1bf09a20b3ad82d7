import type { LoadedPlan } from '../plan/load.js';
import type { FlagTouch } from '../scan/flag-touches.js';
import type { LinkReason, PullRequestInfo } from './context.js';

/**
 * Which plans a change is about: plans named in the pull request's description (by id or path),
 * plan files the change adds or edits, plans whose flags the change touches, and plans whose totals file it adds or edits.
 */
export function linkPlans(options: {
  plans: readonly LoadedPlan[];
  changedPaths: ReadonlySet<string>;
  touches: readonly FlagTouch[];
  pr: PullRequestInfo;
  /** Plan ids of the totals files the change adds or edits. */
  readouts?: ReadonlySet<string>;
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
    if (body.includes(file) || mentionsWord(body, plan.id)) add(plan.id, 'named in the description');
    if (options.changedPaths.has(file)) add(plan.id, 'plan file changed');
    if (plan.flags.some((f) => touched.has(f))) add(plan.id, 'flag touched');
    if (options.readouts?.has(plan.id)) add(plan.id, 'readout changed');
  }
  return links;
}

const WORD_CHAR = /[A-Za-z0-9_]/;

/**
 * Whether `word` appears in `text` as a whole word: "checkout" must not link "checkout-wallet", nor a path
 * segment such as "docs/checkout". Plain string search, so no pattern is ever built from a user's text.
 */
export function mentionsWord(text: string, word: string): boolean {
  if (word === '') return false;
  for (let at = text.indexOf(word); at >= 0; at = text.indexOf(word, at + 1)) {
    const before = text.charAt(at - 1);
    const after = text.charAt(at + word.length);
    const startsWord = before === '' || !(WORD_CHAR.test(before) || before === '/' || before === '-');
    const endsWord = after === '' || !(WORD_CHAR.test(after) || after === '-');
    if (startsWord && endsWord) return true;
  }
  return false;
}
