import { Command, Option } from 'commander';
import { BOUNDARY_KINDS, type BoundaryKind } from '../core/stats/choices.js';
import type { MetricBaseline, SizingRequest } from '../core/stats/sizing.js';
import { UsageError } from '../errors.js';

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
  days?: string;
  method: 'auto' | 'exact' | 'normal';
}

export function addSizeOptions(command: Command): Command {
  return command
    .addOption(new Option('--format <format>', 'output format').choices(['text', 'json', 'markdown']).default('text'))
    .addOption(new Option('--kind <kind>', 'metric kind, to size without a plan').choices(['proportion', 'mean', 'ratio']))
    .option('--baseline <number>', 'baseline rate (proportion, e.g. 0.12) or mean (mean)')
    .option('--sd <number>', 'standard deviation per unit (mean)')
    .option('--numerator <mean,sd>', 'per-unit mean and sd of the numerator (ratio), e.g. 0.9,1.4')
    .option('--denominator <mean,sd>', 'per-unit mean and sd of the denominator (ratio), e.g. 3.2,2.5')
    .option('--correlation <number>', 'correlation of numerator and denominator (ratio)', '0')
    .option('--effect <number>', 'minimum detectable effect, relative (0.03 = 3%) unless --absolute')
    .option('--absolute', 'read --effect in the metric’s own units', false)
    .addOption(new Option('--direction <direction>', 'direction of the effect').choices(['increase', 'decrease']).default('increase'))
    .option('--alpha <number>', 'significance level', '0.05')
    .option('--power <number>', 'power', '0.8')
    .addOption(new Option('--sides <n>', 'one- or two-sided test').choices(['1', '2']).default('2'))
    .option('--arms <weights>', 'arm weights, control first, e.g. 50,50 or 34,33,33', '50,50')
    .option('--daily-units <number>', 'expected new eligible units per day')
    .option('--traffic-share <number>', 'share of eligible units enrolled', '1')
    .option('--reach <number>', 'share of exposed units that reach the change', '1')
    .option('--interim-looks <n>', 'interim analyses before the final one', '0')
    .addOption(new Option('--boundary <kind>', 'stopping boundary for interim looks').choices([...BOUNDARY_KINDS]).default('obrien-fleming-spending'))
    .option('--pre-period-correlation <number>', 'correlation with the pre-period value (CUPED)', '0')
    .option('--cluster-size <number>', 'mean group size, when groups are randomized')
    .option('--icc <number>', 'intra-cluster correlation, when groups are randomized')
    .option('--size-cv <number>', 'coefficient of variation of group sizes', '0')
    .option('--days <n>', 'planned days, for power and detectable effect at the end')
    .addOption(new Option('--method <method>', 'mean and ratio metrics: exact t, normal approximation, or auto').choices(['auto', 'exact', 'normal']).default('auto'));
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

function number(flag: string, text: string | undefined): number {
  const value = Number(text);
  if (text === undefined || text.trim() === '' || !Number.isFinite(value)) {
    throw new UsageError(`--${flag} needs a number; got ${JSON.stringify(text ?? '')}`, `e.g. --${flag} ${EXAMPLES[flag] ?? '0.5'}`);
  }
  return value;
}

function pair(flag: string, text: string | undefined): { mean: number; sd: number } {
  const parts = (text ?? '').split(',');
  if (parts.length !== 2) throw new UsageError(`--${flag} needs a mean and a standard deviation separated by a comma`, `e.g. --${flag} 0.9,1.4`);
  return { mean: number(flag, parts[0]), sd: number(flag, parts[1]) };
}

/** Turns flags into a sizing request; every bad flag is a usage error naming the flag. */
export function requestFromFlags(flags: SizeFlags): SizingRequest {
  if (!flags.kind) throw new UsageError('name a plan (id or file), or describe the metric with --kind', 'e.g. plumbline size checkout-wallet-first, or plumbline size --kind proportion --baseline 0.1 --effect 0.05');
  let baseline: MetricBaseline;
  if (flags.kind === 'proportion') baseline = { kind: 'proportion', rate: number('baseline', flags.baseline) };
  else if (flags.kind === 'mean') baseline = { kind: 'mean', mean: number('baseline', flags.baseline), sd: number('sd', flags.sd) };
  else baseline = { kind: 'ratio', numerator: pair('numerator', flags.numerator), denominator: pair('denominator', flags.denominator), correlation: number('correlation', flags.correlation) };

  const weights = flags.arms.split(',').map((w) => number('arms', w));
  if (weights.length < 2) throw new UsageError('--arms needs at least two weights, control first', 'e.g. --arms 50,50');
  const arms = weights.map((weight, i) => ({ name: i === 0 ? 'control' : weights.length === 2 ? 'treatment' : `treatment-${i}`, weight }));
  const looks = number('interim-looks', flags.interimLooks);
  if (!Number.isInteger(looks) || looks < 0 || looks > 20) throw new UsageError('--interim-looks needs a whole number from 0 to 20');
  const days = flags.days === undefined ? undefined : number('days', flags.days);
  if (days !== undefined && !(Number.isInteger(days) && days > 0)) throw new UsageError('--days needs a whole number of days above 0');
  const effect = flags.effect === undefined ? undefined : number('effect', flags.effect);
  const clusterSize = flags.clusterSize === undefined ? undefined : number('cluster-size', flags.clusterSize);
  if ((clusterSize === undefined) !== (flags.icc === undefined)) throw new UsageError('--cluster-size and --icc go together');

  return {
    baseline,
    direction: flags.direction,
    ...(effect !== undefined ? { effect: flags.absolute ? { absolute: effect } : { relative: effect } } : {}),
    arms,
    control: 'control',
    alpha: number('alpha', flags.alpha),
    power: number('power', flags.power),
    sides: flags.sides === '1' ? 1 : 2,
    ...(flags.dailyUnits !== undefined ? { dailyUnits: number('daily-units', flags.dailyUnits) } : {}),
    trafficShare: number('traffic-share', flags.trafficShare),
    reach: number('reach', flags.reach),
    interimLooks: looks,
    boundary: flags.boundary,
    prePeriodCorrelation: number('pre-period-correlation', flags.prePeriodCorrelation),
    ...(clusterSize !== undefined ? { cluster: { meanSize: clusterSize, icc: number('icc', flags.icc), sizeCv: number('size-cv', flags.sizeCv) } } : {}),
    ...(days !== undefined ? { plannedDays: days } : {}),
    method: flags.method,
  };
}
