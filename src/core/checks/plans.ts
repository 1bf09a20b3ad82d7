import { inclusiveDays } from '../calendar.js';
import { missingDecisions } from '../plan/rules.js';
import type { Check } from '../review/context.js';
import { atPlanKey } from './plan-key.js';
import { countOf } from '../report/numbers.js';
import { formatProblem } from '../source/problem.js';

/** A plan file the change adds or edits must load: its problems block until fixed. */
export const planInvalid: Check = ({ invalidPlanFiles }) =>
  invalidPlanFiles.map(({ file, problems }) => {
    const errors = problems.filter((p) => p.severity === 'error');
    return {
      code: 'plan-invalid',
      message: `${file} cannot be used: ${countOf(errors.length, 'error')}, first: ${formatProblem(errors[0]!)}`,
      fix: 'Run plumbline validate and fix each error.',
      file,
      line: errors[0]?.line ?? 1,
    };
  });

/** Load warnings that a check of its own already reports, so each is said once. */
const REPORTED_BY_A_CHECK: ReadonlySet<string> = new Set(['plan/decisions-missing']);

/**
 * The warnings `plumbline validate` gives for the plans this change is about and the plan or registry
 * files it edits (a renamed key, a default taken), so the review does not look cleaner than validate.
 */
export const fileWarnings: Check = ({ fileWarnings, linked, changedPaths }) => {
  const planOf = new Map(linked.map(({ loaded }) => [loaded.file, loaded.plan.id]));
  const inScope = new Set([...planOf.keys(), ...changedPaths]);
  return fileWarnings
    .filter((p) => inScope.has(p.file) && !REPORTED_BY_A_CHECK.has(p.code))
    .map((p) => {
      const plan = planOf.get(p.file);
      return {
        code: 'file-warning',
        message: `${p.field ? `${p.field}: ` : ''}${p.message} (${p.code})`,
        fix: p.expected ? `Write ${p.expected}; plumbline validate lists every warning.` : 'See plumbline validate, which lists every warning with what it expects.',
        ...(plan ? { plan } : {}),
        file: p.file,
        line: p.line,
      };
    });
};

/** Every outcome needs a rule written before launch, or any result can be read as a win. */
export const decisionsMissing: Check = ({ linked }) =>
  linked.flatMap(({ loaded }) => {
    const missing = missingDecisions(loaded.plan);
    if (missing.length === 0) return [];
    return [
      {
        code: 'decisions-missing',
        message: `No decision rule for ${missing.join(', ')}: without rules written before the data arrives, the result gets read to fit what people hoped.`,
        fix: `Add under decisions: ${missing.map((m) => `${m}: "what you will do"`).join('; ')}.`,
        ...atPlanKey(loaded, ['decisions']),
      },
    ];
  });

export const reasonMissing: Check = ({ linked }) =>
  linked
    .filter(({ loaded }) => !loaded.plan.hypothesis.because)
    .map(({ loaded }) => ({
      code: 'reason-missing',
      message: 'The hypothesis says what changes but not why it should work.',
      fix: 'Add hypothesis.because: the mechanism you expect, so a flat or negative result teaches something.',
      ...atPlanKey(loaded, ['hypothesis']),
    }));

export const guardrailsMissing: Check = ({ linked }) =>
  linked
    .filter(({ loaded }) => loaded.plan.metrics.guardrails.length === 0)
    .map(({ loaded }) => ({
      code: 'guardrails-missing',
      message: 'No guardrail metric: harm elsewhere (errors, latency, cancellations) would go unseen.',
      fix: 'Add metrics.guardrails with a direction and a tolerance each.',
      ...atPlanKey(loaded, ['metrics', 'guardrails']),
    }));

export const windowChecks: Check = ({ linked }) =>
  linked.flatMap(({ loaded }) => {
    const { start, end } = loaded.plan.window;
    const at = atPlanKey(loaded, ['window', 'end']);
    if (!end) {
      return [{ code: 'end-missing', message: 'No planned end date: tests without one run on, and get peeked at until something looks significant.', fix: 'Add window.end.', ...at }];
    }
    if (!start) return [];
    const days = inclusiveDays(start, end);
    if (days < 7) {
      return [{ code: 'window-short', message: `The window is ${countOf(days, 'day')}: less than a week misses weekly cycles.`, fix: 'Plan at least 7 days, in whole weeks.', ...at }];
    }
    if (days % 7 !== 0) {
      return [{ code: 'window-partial-week', message: `The window is ${countOf(days, 'day')}, not a whole number of weeks, so some weekdays count more than others.`, fix: `Make it ${countOf(Math.ceil(days / 7) * 7, 'day')} (${countOf(Math.ceil(days / 7), 'week')}).`, ...at }];
    }
    return [];
  });

export const reviewMissing: Check = ({ linked }) =>
  linked.flatMap(({ loaded }) =>
    loaded.plan.sensitive
      .map((s, index) => ({ ...s, index }))
      .filter((s) => !s.review)
      .map((s) => ({
        code: 'review-missing',
        message: `The plan touches ${s.area}, but names no review for it. Tests in this area can hurt people; Plumbline cannot judge that, and defers to local law and to the people licensed to.`,
        fix: `Name the review under sensitive (review: ...) and get it before launch: ${REVIEW_HINT[s.area]}.`,
        ...atPlanKey(loaded, ['sensitive', s.index]),
      })),
  );

const REVIEW_HINT: Record<string, string> = {
  pricing: 'pricing, finance and legal (price discrimination and consumer law differ by country)',
  legal: 'legal counsel',
  regulatory: 'compliance, with the regulator’s rules for each region in the population',
  minors: 'legal and child-safety review; many places need parental consent or forbid such tests',
  health: 'clinical or medical review, and legal where health data is involved',
  accessibility: 'accessibility review, with assistive-technology testing',
  privacy: 'privacy review (data protection officer where there is one)',
};

export const bundleUnexplained: Check = ({ linked }) =>
  linked
    .filter(({ loaded }) => loaded.plan.flags.length > 1 && !loaded.plan.bundleRationale)
    .map(({ loaded }) => ({
      code: 'bundle-unexplained',
      message: `The plan bundles ${loaded.plan.flags.length} flags (${loaded.plan.flags.join(', ')}): a result will not say which change caused it.`,
      fix: 'Add bundle-rationale, or split the plan.',
      ...atPlanKey(loaded, ['flags']),
    }));

export const populationChecks: Check = ({ linked }) =>
  linked.flatMap(({ loaded }) => {
    const { platforms, locales, ready } = loaded.plan.population;
    const missing = [platforms.length ? '' : 'platforms', locales.length ? '' : 'locales'].filter(Boolean);
    if (missing.length) {
      return [{ code: 'population-undeclared', message: `The population does not declare ${missing.join(' or ')}.`, fix: `Add population.${missing.join(' and population.')}.`, ...atPlanKey(loaded, ['population']) }];
    }
    const notReady = [...platforms.filter((p) => !ready.platforms.includes(p)), ...locales.filter((l) => !ready.locales.includes(l))];
    if (notReady.length === 0) return [];
    return [
      {
        code: 'readiness-missing',
        message: `The change is not declared ready on ${notReady.join(', ')} (rendered, translated), though the population includes ${notReady.length === 1 ? 'it' : 'them'}.`,
        fix: 'Check the change there and add it under population.ready, or take it out of the population.',
        ...atPlanKey(loaded, ['population', 'ready']),
      },
    ];
  });
