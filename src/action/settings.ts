import { z } from 'zod';
import { UsageError } from '../errors.js';

/** The Action's inputs, validated once before any work. Defaults match action.yml. */
const inputsSchema = z.object({
  token: z.string().min(1, { error: 'the token input is empty: pass ${{ github.token }} or a token with pull-requests: write' }),
  config: z.string(),
  mode: z.enum(['auto', 'review', 'digest'], { error: 'mode must be auto, review or digest' }),
  comment: z.enum(['true', 'false'], { error: 'comment must be true or false' }).transform((v) => v === 'true'),
  'fail-on': z.enum(['block', 'warn', 'never'], { error: 'fail-on must be block, warn or never' }),
  'bot-login': z.string().min(1, { error: 'bot-login is empty; the default is github-actions[bot]' }),
  'request-budget': z
    .string()
    .regex(/^\d+$/, { error: 'request-budget must be a whole number, e.g. 200' })
    .transform(Number)
    .refine((n) => n >= 10, { error: 'request-budget must be at least 10' }),
  'rate-limit-wait': z
    .string()
    .regex(/^\d+$/, { error: 'rate-limit-wait must be a whole number of seconds, e.g. 300' })
    .transform(Number)
    .refine((n) => n <= 3600, { error: 'rate-limit-wait must be at most 3600 seconds (GitHub resets its hourly limit within an hour)' }),
});

export type ActionSettings = z.output<typeof inputsSchema>;
export const INPUT_NAMES = Object.keys(inputsSchema.shape) as (keyof typeof inputsSchema.shape)[];

/** Reads every input through `getInput` (the runner's INPUT_* variables) and checks them together. */
export function readActionSettings(getInput: (name: string) => string): ActionSettings {
  const raw = Object.fromEntries(INPUT_NAMES.map((name) => [name, getInput(name).trim()]));
  const parsed = inputsSchema.safeParse(raw);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((i) => `input ${String(i.path[0])}: ${i.message}`);
    throw new UsageError(problems.join('; '), 'fix the with: block of the workflow step that uses this Action');
  }
  return parsed.data;
}
