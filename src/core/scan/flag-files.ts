import { parse } from 'yaml';
import type { FlagTouch } from './flag-touches.js';

/**
 * Flag definition files (a JSON or YAML file that lists flags): a flag added, removed or changed
 * there is touched by the change. A file with a top-level `flags` mapping (as OpenFeature's flagd
 * uses) lists the keys under it; otherwise its top-level keys are the flags.
 */
export const DEFAULT_FLAG_FILES = ['**/flags.json', '**/*.flags.json', '**/*.flagd.json', '**/flags.yaml', '**/flags.yml', '**/*.flags.yaml', '**/*.flags.yml'];

export function flagDefinitions(text: string | undefined): Map<string, string> | undefined {
  if (text === undefined) return new Map();
  let value: unknown;
  try {
    value = parse(text, { maxAliasCount: 100, logLevel: 'silent' });
  } catch {
    return undefined;
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return undefined;
  const record = value as Record<string, unknown>;
  const flags = record.flags !== null && typeof record.flags === 'object' && !Array.isArray(record.flags) ? (record.flags as Record<string, unknown>) : record;
  return new Map(Object.entries(flags).map(([key, definition]) => [key, JSON.stringify(definition)]));
}

/** A YAML line `key:` with the key unquoted (plain string comparison: keys come from the user's file). */
function isPlainKeyLine(line: string, key: string): boolean {
  const rest = line.trimStart();
  return rest.startsWith(key) && rest.slice(key.length).trimStart().startsWith(':');
}

/** Keys added, removed or redefined between the two sides of one flag definition file. */
export function flagDefinitionTouches(path: string, before: string | undefined, after: string | undefined): FlagTouch[] {
  const old = flagDefinitions(before) ?? new Map<string, string>();
  const now = flagDefinitions(after) ?? new Map<string, string>();
  const lineOf = (text: string | undefined, key: string) => {
    if (!text) return 1;
    const index = text.split('\n').findIndex((l) => l.includes(`"${key}"`) || l.includes(`'${key}'`) || isPlainKeyLine(l, key));
    return index < 0 ? 1 : index + 1;
  };
  const touches: FlagTouch[] = [];
  for (const [key, definition] of now) {
    if (old.get(key) !== definition) touches.push({ key, file: path, line: lineOf(after, key), side: 'added', via: 'definition' });
  }
  for (const key of old.keys()) {
    if (!now.has(key)) touches.push({ key, file: path, line: lineOf(before, key), side: 'removed', via: 'definition' });
  }
  return touches;
}
