import { describe, expect, it } from 'vitest';
import { buildDigest } from '../../src/core/digest/build-digest.js';
import { defaultSettings } from '../../src/core/config/load.js';
import { DIGEST_END, DIGEST_MARKER, DIGEST_START, TIMELINE_LIMIT, countLine, mergeDigestBody, renderDigestMarkdown, renderDigestText } from '../../src/core/report/digest-markdown.js';
import { loadPlan } from '../../src/core/plan/load.js';
import { buildRegistry } from '../../src/core/registry/load.js';
import { todayIn } from '../../src/run/digest.js';
import { cleanPlan, planYaml } from '../review/scenarios.js';
import { runCli } from '../cli/helpers.js';

function registryOf(plans: Record<string, unknown>[]) {
  const loaded = plans.map((p, i) => {
    const r = loadPlan(planYaml(p), `experiments/p${i}.yaml`);
    if (!r.ok) throw new Error(JSON.stringify(r.errors));
    return r.loaded;
  });
  return buildRegistry(loaded, []).registry;
}

const digestOf = (plans: Record<string, unknown>[], today: string, flags: string[] = ['good-flag']) =>
  buildDigest({ registry: registryOf(plans), today, settings: defaultSettings(), flagsInCode: new Map(flags.map((f) => [f, { file: 'src/x.ts', line: 1, column: 1 }])) });

describe('buildDigest', () => {
  // Windows: 2026-11-02 to 2026-11-29 unless a case says otherwise.
  it.each([
    ['overdue by 3 days, sample in', [cleanPlan()], '2026-12-02', 'overdue', /by 3 days; the planned sample should be in/],
    ['overdue, sample not in', [cleanPlan({ design: { 'min-detectable-effect': { relative: 0.01 }, 'daily-units': 500 } })], '2026-12-02', 'overdue', /not in yet by the plan’s own traffic estimate/],
    ['ending within 7 days', [cleanPlan()], '2026-11-25', 'ending-soon', /in 4 days/],
    ['a draft past its start', [cleanPlan({ state: 'draft' })], '2026-11-05', 'draft-past-start', /still a draft/],
    ['on hold too long', [cleanPlan({ state: 'on-hold' })], '2026-11-20', 'long-on-hold', /18 days after its start/],
    ['a live plan whose flag left the code', [cleanPlan()], '2026-11-10', 'flag-gone', /no longer appears/],
    ['two live tests colliding', [cleanPlan(), cleanPlan({ id: 'other', flags: ['good-flag'], owners: ['@owner-two'], surface: { path: 'shop/cart/total' } })], '2026-11-10', 'collision', /alongside other/],
  ])('%s', async (name, plans, today, kind, detail) => {
    const digest = digestOf(plans, today, kind === 'flag-gone' ? [] : ['good-flag']);
    const items = digest.tests.flatMap((t) => t.items).filter((i) => i.kind === kind);
    expect(items.length).toBeGreaterThan(0);
    expect(items[0]!.detail).toMatch(detail);
    expect(digest.counts[kind as 'overdue']).toBeGreaterThan(0);
    const slug = name.replace(/[^a-z0-9]+/gi, '-').toLowerCase();
    await expect(renderDigestMarkdown(digest)).toMatchFileSnapshot(`golden/case-${slug}.md`);
    await expect(`${JSON.stringify(digest, null, 2)}\n`).toMatchFileSnapshot(`golden/case-${slug}.json`);
  });

  it.each([
    ['not yet overdue on its last day', [cleanPlan()], '2026-11-29', 'overdue'],
    ['not ending soon eight days out', [cleanPlan()], '2026-11-21', 'ending-soon'],
    ['a draft whose start is still ahead', [cleanPlan({ state: 'draft' })], '2026-11-01', 'draft-past-start'],
    ['on hold for exactly the allowed days', [cleanPlan({ state: 'on-hold' })], '2026-11-16', 'long-on-hold'],
    ['a concluded plan without its flag', [cleanPlan({ state: 'concluded' })], '2026-12-20', 'flag-gone'],
    ['colliding tests that declare the overlap', [cleanPlan({ surface: { path: 'shop/cart', 'overlaps-with': ['other'] } }), cleanPlan({ id: 'other', owners: ['@owner-two'] })], '2026-11-10', 'collision'],
  ])('near miss: %s', (_name, plans, today, kind) => {
    const digest = digestOf(plans, today, kind === 'flag-gone' ? [] : ['good-flag']);
    expect(digest.tests.flatMap((t) => t.items).filter((i) => i.kind === kind)).toEqual([]);
  });

  it('lists flag keys in code that no plan or exemption covers', () => {
    const digest = digestOf([cleanPlan()], '2026-11-10', ['good-flag', 'stray-flag']);
    expect(digest.orphanFlags.map((f) => f.key)).toEqual(['stray-flag']);
  });

  it('reads today in the settings’ time zone', () => {
    const lateEvening = new Date('2026-12-01T23:30:00Z');
    expect(todayIn('UTC', lateEvening)).toBe('2026-12-01');
    expect(todayIn('Asia/Tokyo', lateEvening)).toBe('2026-12-02');
    expect(todayIn('America/Los_Angeles', lateEvening)).toBe('2026-12-01');
  });

  it('reads the same UTC day as the time-zone database, around midnight and in leap years', () => {
    const utc = new Intl.DateTimeFormat('en-CA', { timeZone: 'Etc/UTC', year: 'numeric', month: '2-digit', day: '2-digit' });
    for (const at of ['2026-12-01T23:59:59.999Z', '2026-12-02T00:00:00Z', '2028-02-29T12:00:00Z', '1999-12-31T23:59:59Z', '2026-06-30T00:00:00.001Z']) {
      expect(todayIn('UTC', new Date(at))).toBe(utc.format(new Date(at)));
    }
  });
});

describe('the digest issue body', () => {
  it('mentions each owner once, and nobody else', () => {
    const plans = [cleanPlan(), cleanPlan({ id: 'other', owners: ['@owner-two'], surface: { path: 'shop/cart/total' } })];
    const body = renderDigestMarkdown(digestOf(plans, '2026-12-02'));
    expect(body.match(/(^|\s)@owner-one\b/g)).toHaveLength(1);
    expect(body.match(/(^|\s)@owner-two\b/g)).toHaveLength(1);
    expect(body.startsWith(`${DIGEST_MARKER}\n${DIGEST_START}`)).toBe(true);
    expect(body.endsWith(DIGEST_END)).toBe(true);
  });

  it('lists a test with two owners once, owners beside it, each owner mentioned once across tests', () => {
    const plans = [
      cleanPlan({ owners: ['@owner-one', '@team/two'] }),
      cleanPlan({ id: 'other', flags: ['good-flag'], owners: ['@team/two'], surface: { path: 'shop/search' } }),
    ];
    const digest = digestOf(plans, '2026-12-02');
    expect(digest.tests.map((t) => `${t.id}:${t.owners.join(',')}:${t.items.map((i) => i.kind).join(',')}`)).toEqual(['good:@owner-one,@team/two:overdue', 'other:@team/two:overdue']);
    const body = renderDigestMarkdown(digest);
    expect(body.match(/`good`/g)).toHaveLength(1);
    expect(body).toMatch(/^- \*\*`good`\*\* Good test · @owner-one, @team\/two · `experiments\/p0\.yaml:1`\n {2}- ⏰ past its end: Past its planned end \(2026-11-29\) by 3 days/m);
    // The second time @team/two appears it is inert text (a zero-width space after the @), so nobody is notified twice.
    expect(body.match(/(^|\s)@team\/two\b/g)).toHaveLength(1);
    expect(body).toContain('@\u200bteam/two');
    const text = renderDigestText(digest);
    expect(text.match(/^good /gm)).toHaveLength(1);
  });

  it('leaves zero counts out of the headline and gets singular and plural right', () => {
    const one = digestOf([cleanPlan({ state: 'draft' })], '2026-11-05');
    expect(countLine(one)).toBe('1 draft past its start — 1 draft');
    const two = digestOf([cleanPlan(), cleanPlan({ id: 'other', flags: ['good-flag'], surface: { path: 'shop/search' } })], '2026-12-02');
    expect(countLine(two)).toBe('2 past their planned end — 2 live');
    const quiet = digestOf([cleanPlan({ state: 'concluded' })], '2026-12-02');
    expect(countLine(quiet)).toBe('nothing needs attention — no live tests or drafts');
  });

  it('keeps the timeline readable with 100+ tests and stays under the limit', () => {
    const plans = Array.from({ length: 120 }, (_, i) => cleanPlan({ id: `test-${i}`, flags: [`flag-${i}`], surface: { path: `zone${i % 7}/page${i}` } }));
    const digest = digestOf(plans, '2026-11-10', plans.map((_, i) => `flag-${i}`));
    const body = renderDigestMarkdown(digest);
    expect(body.length).toBeLessThanOrEqual(65536);
    expect((body.match(/:active, t\d+/g) ?? []).length).toBe(TIMELINE_LIMIT);
    expect(body).toContain(`${120 - TIMELINE_LIMIT} more tests are not drawn`);
  });

  it('keeps what a person wrote around the block', () => {
    const first = mergeDigestBody(undefined, `${DIGEST_MARKER}\n${DIGEST_START}\nweek 1\n${DIGEST_END}`);
    const edited = `Team notes on top.\n\n${first}\n\nAnd a question below.`;
    const next = mergeDigestBody(edited, `${DIGEST_MARKER}\n${DIGEST_START}\nweek 2\n${DIGEST_END}`);
    expect(next).toContain('Team notes on top.');
    expect(next).toContain('And a question below.');
    expect(next).toContain('week 2');
    expect(next).not.toContain('week 1');
    expect(next.split(DIGEST_MARKER)).toHaveLength(2);
  });
});

describe('plumbline digest on the demo', () => {
  it.each(['text', 'markdown', 'json'])('matches the golden %s output for --today 2026-12-08', async (format) => {
    const run = runCli(['-C', 'demo/repo', 'digest', '--today', '2026-12-08', '--format', format]);
    expect(run.status).toBe(0);
    await expect(run.stdout).toMatchFileSnapshot(`golden/demo-digest.${format === 'markdown' ? 'md' : format === 'json' ? 'json' : 'txt'}`);
  });

  it('refuses a bad --today', () => {
    expect(runCli(['-C', 'demo/repo', 'digest', '--today', '2026-13-01']).status).toBe(2);
  });
});
