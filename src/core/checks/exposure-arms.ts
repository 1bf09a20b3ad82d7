import type { Check } from '../review/context.js';
import { findCalls } from '../scan/calls.js';
import { evidenceKindOf } from '../scan/evidence.js';
import { exposureInOneArm } from '../scan/exposure-branch.js';
import { flagReadsOf } from '../scan/flag-touches.js';
import { flagPatternsOf, logPatternsOf } from '../scan/patterns.js';

/**
 * Exposure must be logged in every arm, control included. A logging call inside a branch on the flag,
 * or after an early return on its value, logs only some arms: the arms are then compared over different
 * people, and the test shows a sample ratio mismatch or a biased effect. A heuristic, so a warning
 * that quotes the lines it read.
 */
export const exposureOneArm: Check = (context) => {
  const flagPatterns = flagPatternsOf(context.settings);
  const logPatterns = logPatternsOf(context.settings);
  return context.linked.flatMap(({ loaded }) => {
    const { plan } = loaded;
    const event = plan.exposure.event;
    if (!event) return [];
    const keys = new Set(plan.flags);
    return [...context.codeAtHead].flatMap(([path, text]) => {
      if (evidenceKindOf(path) !== 'code' || !text.includes(event)) return [];
      const reads = flagReadsOf(text, path, flagPatterns, keys);
      const exposures = findCalls(text, path, logPatterns).filter((s) => s.groups.event === event);
      return exposureInOneArm(text, path, reads, exposures).map((found) => ({
        code: 'exposure-one-arm',
        message: `Exposure event \`${event}\` is logged ${found.kind === 'branch' ? 'inside a branch on' : 'after an early return on'} the value of ${plan.flags.map((f) => `\`${f}\``).join(', ')}, so some arms never log it: line ${found.flag.line} \`${found.flag.text}\`, line ${found.condition.line} \`${found.condition.text}\`, line ${found.exposure.line} \`${found.exposure.text}\`. The arms are then compared over different people (a classic cause of sample ratio mismatch).`,
        fix: 'Log exposure where the arms first differ, in every arm, control included: right after the flag is read, before any branch or return on its value.',
        plan: plan.id,
        file: path,
        line: found.exposure.line,
      }));
    });
  });
};
