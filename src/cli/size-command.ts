import { Command, Option } from 'commander';
import { renderSizingMarkdown, renderSizingText, sizingJson } from '../core/report/sizing.js';
import { sizeFromRequest, sizeNamedPlan } from '../run/size.js';
import { EXIT, context, type CommonOptions, type SetExit, type CliDeps } from './common.js';
import type { ZodType } from 'zod';
import { SIZING_FLAG_FIELDS } from '../core/plan/schema.js';
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
  groups?: string;
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
    .option('--daily-units <number>', 'new eligible units per day (units not seen before that day)')
    .option('--traffic-share <number>', 'share of eligible units enrolled', '1')
    .option('--reach <number>', 'share of exposed units that reach the change', '1')
    .option('--interim-looks <n>', 'interim analyses before the final one', '0')
    .addOption(new Option('--boundary <kind>', 'stopping boundary for interim looks').choices([...BOUNDARY_KINDS]).default('obrien-fleming-spending'))
    .option('--pre-period-correlation <number>', 'correlation with the pre-period value (CUPED)', '0')
    .option('--cluster-size <number>', 'mean group size, when groups are randomized')
    .option('--icc <number>', 'intra-cluster correlation, when groups are randomized')
    .option('--size-cv <number>', 'coefficient of variation of group sizes', '0')
    .option('--groups <number>', 'how many groups exist to randomize, when groups are randomized')
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

/** A plain decimal number as people write it: no hex, binary, octal, Infinity or blanks. */
const DECIMAL = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;

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
  const dailyUnits = flags.dailyUnits === undefined ? undefined : field('daily-units', flags.dailyUnits, F['daily-units']);
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

/** `plumbline size [plan]`: units per arm, days, power and detectable effect. */
export function addSizeCommand(program: Command, setExit: SetExit, deps: CliDeps): void {
  addSizeOptions(
    program
      .command('size')
      .description('size a test: units per arm, days, power and detectable effect by the planned end')
      .argument('[plan]', 'plan id or plan file; omit to describe a metric with --kind and the flags below'),
  ).action(async (planName: string | undefined, flags: SizeFlags) => {
    const options = program.opts<CommonOptions>();
    const { output, ...ports } = context({ ...options, format: 'text' }, deps);
    if (planName && flags.kind) throw new UsageError('name a plan or give --kind, not both');
    const outcome = planName ? await sizeNamedPlan({ ...ports, plan: planName }) : sizeFromRequest(requestFromFlags(flags));
    if (!planName && !outcome.sizing.metrics[0]!.result.ok) {
      const { error } = outcome.sizing.metrics[0]!.result;
      throw new UsageError(`cannot size this metric: ${error.input}: ${error.message}`);
    }
    if (flags.format === 'json') output.out(JSON.stringify(sizingJson(outcome.sizing, outcome.context), null, 2));
    else if (flags.format === 'markdown') output.out(renderSizingMarkdown(outcome.sizing, { ...outcome.context, power: outcome.power }));
    else output.out(renderSizingText(outcome.sizing, outcome.context));
    setExit(EXIT.ok);
  });
}
