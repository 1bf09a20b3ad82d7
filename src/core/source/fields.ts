import { z } from 'zod';

/**
 * Field builders shared by every file format. Each carries the sentence that completes
 * "expected ...", so every problem can say what a valid value looks like.
 */

/** The "expected ..." phrase, as a sentence, doubles as the field's description in the JSON Schema and docs. */
export function asDescription(expected: string): string {
  return `${expected.charAt(0).toUpperCase()}${expected.slice(1)}.`;
}

export const text = (expected: string) =>
  z.string({ error: expected }).trim().min(1, { error: expected }).describe(asDescription(expected));

export const optionalText = (expected: string) => text(expected).optional();

/**
 * The longest id or name (plan ids, metric, arm and group names). Ids are looked for in pull-request
 * descriptions and printed in comment headings; 100 characters is far past any readable id and keeps that
 * search and those headings small.
 */
export const NAME_MAX_LENGTH = 100;

/** Lower-case words joined by hyphens, the way ids and names are written across plan files. */
export const kebabName = (expected: string) =>
  z
    .string({ error: expected })
    .max(NAME_MAX_LENGTH, { error: `${expected}, at most ${NAME_MAX_LENGTH} characters long` })
    .regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: expected })
    .describe(asDescription(expected));

/** A share strictly between 0 and 1, such as a significance level or a baseline rate. */
export const openShare = (expected: string) =>
  z.number({ error: expected }).gt(0, { error: expected }).lt(1, { error: expected }).describe(asDescription(expected));

/** A share in (0, 1], such as the reach of an exposure or the share of traffic in a test. */
export const positiveShare = (expected: string) =>
  z.number({ error: expected }).gt(0, { error: expected }).lte(1, { error: expected }).describe(asDescription(expected));

export const positiveNumber = (expected: string) => z.number({ error: expected }).gt(0, { error: expected }).describe(asDescription(expected));

export const nonNegativeNumber = (expected: string) =>
  z.number({ error: expected }).gte(0, { error: expected }).describe(asDescription(expected));

export const finiteNumber = (expected: string) => z.number({ error: expected }).describe(asDescription(expected));

export const wholeNumber = (expected: string, min: number, max: number) =>
  z.number({ error: expected }).int({ error: expected }).gte(min, { error: expected }).lte(max, { error: expected }).describe(asDescription(expected));

const CALENDAR_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** True for a real day in the Gregorian calendar written YYYY-MM-DD (rejects 2026-02-30). */
export function isCalendarDate(value: string): boolean {
  const match = CALENDAR_DATE.exec(value);
  if (!match) return false;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCFullYear() === year && date.getUTCMonth() === month - 1 && date.getUTCDate() === day;
}

export const calendarDate = (expected: string) =>
  z
    .string({ error: expected })
    .regex(CALENDAR_DATE, { error: expected })
    .refine(isCalendarDate, { error: `${expected}, on a day that exists in the calendar` })
    .describe(asDescription(expected));

/** A list whose items appear once each; `min` is the fewest items allowed (default 0). */
export const uniqueList = <T extends z.ZodType>(item: T, expected: string, min = 0, fewMessage = expected) =>
  z
    .array(item, { error: expected })
    .min(min, { error: fewMessage })
    .refine((items) => new Set(items.map((i) => JSON.stringify(i))).size === items.length, {
      error: `${expected}, each listed once`,
    })
    .describe(asDescription(expected));
