import type { ZodType } from 'zod';
import { DAILY_UNITS, type NumberBound } from '../core/plan/number-rules.js';
import { SIZING_FLAG_FIELDS } from '../core/plan/schema.js';
import type { BoundaryKind } from '../core/stats/choices.js';
import type { MetricBaseline, SizingRequest } from '../core/stats/sizing.js';
import { UsageError } from '../errors.js';
import { DECIMAL } from './common.js';

/*
 * The `size` command's flags turned into a sizing request. Kept apart from the command's options
 * because it validates with the plan schema (zod), which only a run of `size` should load.
 */

/** The `size` command's options: a plan, or a metric described by flags. */
export interface SizeFlags {
  format: 'text' | 'json' | 'markdown';
  kind?: 'proportion' | 'mean' | 'ratio';
  baseline?: string;
  sd?: string;
  numerator?: string;
  denominator?: string;
  correlation?: string;
  effect?: string;
  absolute: boolean;
  direction: 'increase' | 'decrease';
  alpha: string;
  power: string;
  sides: string;
  arms: string;
  dailyUnits?: string;
  trafficShare: string;
  reach: string;
  interimLooks: string;
  boundary: BoundaryKind;
  prePeriodCorrelation: string;
  clusterSize?: string;
  icc?: string;
  sizeCv: string;
  groups?: string;
  days?: string;
  method: 'auto' | 'exact' | 'normal';
}

const EXAMPLES: Record<string, string> = {
  baseline: '0.12 (a rate) or 42.5 (a mean)',
  sd: '30',
  effect: '0.03 (3% relative)',
  alpha: '0.05',
  power: '0.8',
  arms: '50,50',
  'daily-units': '12000',
  days: '28',
};

function number(flag: string, text: string | undefined, required = ''): number {
  if (text === undefined) throw new UsageError(`--${flag} is required${required}`, `e.g. --${flag} ${EXAMPLES[flag] ?? '0.5'}`);
  const value = Number(text.trim());
  if (!DECIMAL.test(text.trim()) || !Number.isFinite(value)) {
    throw new UsageError(`--${flag} needs a decimal number; got ${JSON.stringify(text)}`, `e.g. --${flag} ${EXAMPLES[flag] ?? '0.5'}`);
  }
  return value;
}

/** Reads a flag and validates it with the plan field that holds the same figure. */
function field(flag: string, text: string | undefined, schema: ZodType<number>, required = ''): number {
  const value = number(flag, text, required);
  const checked = schema.safeParse(value);
  if (!checked.success) throw new UsageError(`--${flag} needs ${checked.error.issues[0]?.message ?? 'a valid value'}; got ${text}`);
  return checked.data;
}

/** A flag held to the range the plan's rules give the same figure (core/plan/number-rules.ts), so the CLI takes what a plan may hold. */
function bounded(flag: string, value: number, bound: NumberBound): number {
  if (value >= bound.min && value <= bound.max) return value;
  throw new UsageError(`--${flag} is ${value < bound.min ? 'too small' : 'too large'} for sizing to give a meaningful figure; got ${value}`, `expected ${bound.why}`);
}

function pair(flag: string, text: string | undefined, required: string, meanSchema: ZodType<number>): { mean: number; sd: number } {
  if (text === undefined) throw new UsageError(`--${flag} is required${required}`, `e.g. --${flag} 0.9,1.4`);
  const parts = text.split(',');
  if (parts.length !== 2) throw new UsageError(`--${flag} needs a mean and a standard deviation separated by a comma`, `e.g. --${flag} 0.9,1.4`);
  return { mean: field(flag, parts[0], meanSchema), sd: field(flag, parts[1], F['moment-sd']) };
}

const F = SIZING_FLAG_FIELDS;

/** Turns flags into a sizing request; every bad flag is a usage error naming the flag. */
export function requestFromFlags(flags: SizeFlags): SizingRequest {
  if (!flags.kind) throw new UsageError('name a plan (id or file), or describe the metric with --kind', 'e.g. plumbline size checkout-wallet-first, or plumbline size --kind proportion --baseline 0.1 --effect 0.05');
  const forKind = ` for --kind ${flags.kind}`;
  let baseline: MetricBaseline;
  if (flags.kind === 'proportion') baseline = { kind: 'proportion', rate: field('baseline', flags.baseline, F.rate, forKind) };
  else if (flags.kind === 'mean') baseline = { kind: 'mean', mean: field('baseline', flags.baseline, F.mean, forKind), sd: field('sd', flags.sd, F.sd, forKind) };
  else {
    baseline = {
      kind: 'ratio',
      numerator: pair('numerator', flags.numerator, forKind, F['moment-mean']),
      denominator: pair('denominator', flags.denominator, forKind, F['denominator-mean']),
      correlation: field('correlation', flags.correlation, F.correlation),
    };
  }

  const weights = flags.arms.split(',').map((w) => field('arms', w, F['arm-weight']));
  if (weights.length < 2) throw new UsageError('--arms needs at least two weights, control first', 'e.g. --arms 50,50');
  const arms = weights.map((weight, i) => ({ name: i === 0 ? 'control' : weights.length === 2 ? 'treatment' : `treatment-${i}`, weight }));
  const looks = field('interim-looks', flags.interimLooks, F['interim-looks']);
  const days = flags.days === undefined ? undefined : number('days', flags.days);
  if (days !== undefined && !(Number.isInteger(days) && days > 0)) throw new UsageError('--days needs a whole number of days above 0');
  const effect = flags.effect === undefined ? undefined : field('effect', flags.effect, flags.absolute ? F['effect-absolute'] : F.effect);
  const dailyUnits = flags.dailyUnits === undefined ? undefined : bounded('daily-units', field('daily-units', flags.dailyUnits, F['daily-units']), DAILY_UNITS);
  if (effect === undefined && (days === undefined || dailyUnits === undefined)) {
    throw new UsageError(
      days === undefined ? '--effect is required, unless --days and --daily-units ask what is detectable by then' : '--days without --effect asks what is detectable by then, which needs --daily-units',
      'e.g. --effect 0.03, or --days 28 --daily-units 12000',
    );
  }
  const clusterSize = flags.clusterSize === undefined ? undefined : field('cluster-size', flags.clusterSize, F['cluster-size']);
  if ((clusterSize === undefined) !== (flags.icc === undefined)) throw new UsageError('--cluster-size and --icc go together');
  const groupsAvailable = flags.groups === undefined ? undefined : field('groups', flags.groups, F['groups-available']);

  return {
    baseline,
    direction: flags.direction,
    ...(effect !== undefined ? { effect: flags.absolute ? { absolute: effect } : { relative: effect } } : {}),
    arms,
    control: 'control',
    alpha: field('alpha', flags.alpha, F.alpha),
    power: field('power', flags.power, F.power),
    sides: flags.sides === '1' ? 1 : 2,
    ...(dailyUnits !== undefined ? { dailyUnits } : {}),
    trafficShare: field('traffic-share', flags.trafficShare, F['traffic-share']),
    reach: field('reach', flags.reach, F.reach),
    interimLooks: looks,
    boundary: flags.boundary,
    prePeriodCorrelation: field('pre-period-correlation', flags.prePeriodCorrelation, F['pre-period-correlation']),
    ...(clusterSize !== undefined
      ? { cluster: { meanSize: clusterSize, icc: field('icc', flags.icc, F.icc), sizeCv: field('size-cv', flags.sizeCv, F['size-cv']), ...(groupsAvailable !== undefined ? { available: groupsAvailable } : {}) } }
      : {}),
    ...(days !== undefined ? { plannedDays: days } : {}),
    method: flags.method,
  };
}
