import { z } from 'zod';
import { text, uniqueList } from '../source/fields.js';
import { flagKey, surfacePath } from '../plan/schema.js';

/**
 * The repository's settings file (`.plumbline.yml`). Every key is optional: with no file at all,
 * the defaults below are a working configuration.
 */

export const SEVERITY_LEVELS = ['block', 'warn', 'note', 'off'] as const;
export type SeverityLevel = (typeof SEVERITY_LEVELS)[number];

function compiles(pattern: string): boolean {
  try {
    new RegExp(pattern, 'u');
    return true;
  } catch {
    return false;
  }
}

/** A regular expression (JavaScript syntax, `u` flag) with a named group that captures the key or event. */
const callPattern = (group: 'key' | 'event', example: string) => {
  const expected = `a regular expression with a (?<${group}>...) group, e.g. ${example}`;
  return z
    .string({ error: expected })
    .refine(compiles, { error: `${expected}; this one does not compile` })
    .refine((p) => p.includes(`(?<${group}>`), { error: `${expected}; this one has no (?<${group}>...) group` });
};

const pathGlob = text('a path or glob relative to the repository root, e.g. src/** or experiments');

export const DEFAULT_PLAN_FOLDERS = ['experiments'];
export const DEFAULT_SCAN_EXCLUDE = ['**/node_modules/**', '**/dist/**', '**/build/**', '**/vendor/**', '**/*.min.js', '**/*.map'];

export const writtenSettingsSchema = z
  .strictObject(
    {
      plans: uniqueList(pathGlob, 'a list of folders or globs that hold plan files, e.g. [experiments]')
        .default(DEFAULT_PLAN_FOLDERS)
        .describe('Where plan files live: folders (every .yaml/.yml file below) or globs. Default: [experiments].'),
      registries: uniqueList(pathGlob, 'a list of registry files, e.g. [ops/other-tests.yaml]')
        .default([])
        .describe('Extra registry files listing tests defined elsewhere.'),
      'flag-calls': z
        .array(callPattern('key', String.raw`isOn\(\s*["'](?<key>[\w.-]+)["']`), { error: 'a list of flag-call patterns' })
        .default([])
        .describe('Extra patterns for code that evaluates a feature flag; added to the built-in ones.'),
      'log-calls': z
        .array(callPattern('event', String.raw`logEvent\(\s*["'](?<event>[\w.-]+)["']`), { error: 'a list of logging-call patterns' })
        .default([])
        .describe('Extra patterns for code that logs an event; added to the built-in ones.'),
      'builtin-patterns': z
        .boolean({ error: 'true or false' })
        .default(true)
        .describe('Set false to use only the patterns written here.'),
      'group-surfaces': uniqueList(surfacePath, 'a list of surface paths shared between people, e.g. [teams/board]')
        .default([])
        .describe('Surfaces (and everything below them) where people interact, so the unit must be a group.'),
      scan: z
        .strictObject(
          {
            include: uniqueList(pathGlob, 'a list of globs to scan, e.g. [src/**]').default(['**']),
            exclude: uniqueList(pathGlob, 'a list of globs to skip, e.g. [**/fixtures/**]').default(DEFAULT_SCAN_EXCLUDE),
          },
          { error: 'a mapping with include and exclude' },
        )
        .default({ include: ['**'], exclude: DEFAULT_SCAN_EXCLUDE })
        .describe('Which tracked files are searched for flags and events.'),
      'exempt-flags': uniqueList(flagKey, 'a list of flag keys that need no plan, e.g. [kill-payments]')
        .default([])
        .describe('Flags that are not experiments (kill switches, operational toggles).'),
      severity: z
        .record(
          z.string().regex(/^[a-z0-9]+(?:[-/][a-z0-9]+)*$/, { error: 'a finding code, e.g. plan-missing' }),
          z.enum(SEVERITY_LEVELS, { error: `one of ${SEVERITY_LEVELS.join(', ')}` }),
          { error: 'a mapping of finding code to block, warn, note or off' },
        )
        .default({})
        .describe('Raise or lower the severity of findings by code.'),
    },
    { error: 'a settings file: a mapping of settings' },
  )
  .describe('Plumbline repository settings.');

export const settingsSchema = writtenSettingsSchema.transform((w) => ({
  planPaths: w.plans,
  registryFiles: w.registries,
  flagCalls: w['flag-calls'],
  logCalls: w['log-calls'],
  builtinPatterns: w['builtin-patterns'],
  groupSurfaces: w['group-surfaces'],
  scan: w.scan,
  exemptFlags: w['exempt-flags'],
  severity: w.severity as Record<string, SeverityLevel>,
}));

/** Normalized repository settings. */
export type Settings = z.output<typeof settingsSchema>;
