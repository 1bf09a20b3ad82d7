import { describe, expect, it } from 'vitest';
import { addDays, daysBetween, inclusiveDays } from '../../src/core/calendar.js';
import { planSearchRoots } from '../../src/core/config/plan-files.js';
import { closestName } from '../../src/core/source/closest-name.js';
import { isCalendarDate } from '../../src/core/source/fields.js';
import { terminalSafe } from '../../src/core/report/terminal-style.js';

describe('closestName', () => {
  const known = ['alpha', 'power', 'min-detectable-effect', 'daily-units', 'interim-looks'];
  it.each([
    ['alpah', 'alpha'],
    ['powr', 'power'],
    ['minDetectableEffect', 'min-detectable-effect'],
    ['daily_units', 'daily-units'],
    ['interim-look', 'interim-looks'],
    ['colour', undefined],
    ['x', undefined],
  ])('%s -> %s', (typed, expected) => expect(closestName(typed, known)).toBe(expected));
});

describe('calendar dates', () => {
  it.each([
    ['2026-02-28', true],
    ['2028-02-29', true],
    ['2026-02-29', false],
    ['2026-02-30', false],
    ['2026-13-01', false],
    ['2026-1-01', false],
    ['26-01-01', false],
  ])('%s is a date: %s', (text, ok) => expect(isCalendarDate(text)).toBe(ok));

  it('counts days in UTC across a month and a year end', () => {
    expect(addDays('2026-12-29', 7)).toBe('2027-01-05');
    expect(daysBetween('2026-11-02', '2026-11-29')).toBe(27);
    expect(inclusiveDays('2026-11-02', '2026-11-29')).toBe(28);
    // 2027-03-28 is when clocks change in much of Europe; UTC dates must not notice.
    expect(daysBetween('2027-03-27', '2027-03-29')).toBe(2);
  });
});

describe('planSearchRoots', () => {
  const pick = (entries: string[], paths: string[]) =>
    planSearchRoots(entries).flatMap((root) => paths.filter((p) => p.startsWith(root.folder) && root.matches(p)));
  const paths = ['experiments/a.yaml', 'experiments/deep/b.yml', 'experiments/readme.md', 'services/pay/experiments/c.yaml', 'other/d.yaml'];
  it('treats a plain path as a folder of yaml files', () => expect(pick(['experiments'], paths)).toEqual(['experiments/a.yaml', 'experiments/deep/b.yml']));
  it('lists a glob from its static prefix', () => expect(pick(['services/*/experiments/*.yaml'], paths)).toEqual(['services/pay/experiments/c.yaml']));
  it('accepts a single plan file', () => expect(pick(['other/d.yaml'], paths)).toEqual(['other/d.yaml']));
  it('accepts ./ and a trailing slash', () => expect(pick(['./experiments/'], paths)).toHaveLength(2));
});

describe('terminalSafe', () => {
  it('neutralises escape sequences and line breaks from user text', () => {
    expect(terminalSafe('ok\u001b[31mred\u001b[0m\nnext')).toBe('ok\uFFFD[31mred\uFFFD[0m next');
  });
});

describe('closestName with other spellings of one word', () => {
  it.each([
    ['registry', ['plans', 'registries'], 'registries'],
    ['owner', ['owners', 'title'], 'owners'],
    ['guardrail', ['primary', 'guardrails', 'secondary'], 'guardrails'],
  ])('%s -> %s', (typed, known, expected) => expect(closestName(typed, known)).toBe(expected));
});
