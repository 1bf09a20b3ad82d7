import { parse } from 'yaml';

/**
 * The flag keys a plan file names under `flags:`, read leniently from a plan that does not load, so a
 * flag whose plan is broken is reported as "plan invalid" rather than as a flag without a plan (whose fix
 * would be to write a second plan). Empty when the text does not get that far.
 */
export function declaredFlags(text: string | undefined): string[] {
  if (text === undefined) return [];
  let value: unknown;
  try {
    // Silent: the plan's own load reports what is wrong with it; the yaml package would warn on stderr.
    value = parse(text, { maxAliasCount: 100, uniqueKeys: false, logLevel: 'silent' });
  } catch {
    return [];
  }
  if (value === null || typeof value !== 'object' || Array.isArray(value)) return [];
  const flags = (value as { flags?: unknown }).flags;
  return Array.isArray(flags) ? flags.filter((f): f is string => typeof f === 'string') : [];
}
