import { execFileSync } from 'node:child_process';
import { rmSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { openChange } from '../../src/adapters/git.js';
import type { Review } from '../../src/core/review/build-review.js';
import { planAnnotations } from '../../src/action/effects.js';
import { renderReviewMarkdown } from '../../src/core/report/review-markdown.js';
import { frozenPlans } from '../../src/core/checks/frozen-plan.js';
import type { ReviewContext } from '../../src/core/review/context.js';
import { reviewChange } from '../../src/run/review-change.js';
import { makeTwoCommitRepo } from '../helpers/git-repo.js';
import { baseFiles, cleanPlan, planYaml, CART_CODE, CART_CODE_TOUCHED } from './scenarios.js';

// A test that has started: its plan, its flag reads and its events are guarded against silent change.

const made: string[] = [];
afterAll(() => made.forEach((root) => rmSync(root, { recursive: true, force: true })), 60_000);
const TODAY = '2026-11-16';

async function review(files: Record<string, string>, changes: Record<string, string | null>, today = TODAY): Promise<Review> {
  const repo = makeTwoCommitRepo(files, changes);
  made.push(repo.root);
  const outcome = await reviewChange({ change: await openChange(repo.root, 'main', 'HEAD'), today });
  if (outcome.kind !== 'review') throw new Error(JSON.stringify(outcome.problems));
  return outcome.review;
}

/** GitHub's own Markdown renderer (cmark-gfm with the table extension), not our parser. */
const render = (markdown: string) => execFileSync('cmark-gfm', ['-e', 'table', '-e', 'autolink', '-e', 'strikethrough', '-e', 'tagfilter'], { input: markdown, encoding: 'utf8' });

const codes = (r: Review) => r.findings.map((f) => f.code);

describe('frozen plans', () => {
  it('blocks the cherry-pick: primary switched, tolerance widened, end pushed out, loss rule rewritten', async () => {
    const metrics = cleanPlan().metrics as { guardrails: Record<string, unknown>[] };
    const head = cleanPlan({
      window: { start: '2026-11-02', end: '2026-12-27' },
      metrics: {
        primary: { name: 'cart-views', kind: 'proportion', baseline: { rate: 0.3 }, events: ['cart_viewed'] },
        guardrails: [{ ...metrics.guardrails[0], tolerance: { relative: 2 } }],
      },
      decisions: { win: 'Ship.', flat: 'Drop.', loss: 'Ship it anyway.', 'guardrail-breach': 'Stop.' },
    });
    const r = await review(baseFiles(), { 'experiments/good.yaml': planYaml(head) });
    const frozen = r.findings.find((f) => f.code === 'plan-frozen')!;
    expect(frozen.severity).toBe('block');
    expect(frozen.changes).toEqual(
      expect.arrayContaining([
        { field: 'metrics.primary.name', before: 'bought', after: 'cart-views' },
        { field: 'metrics.primary.events', before: '[order_done]', after: '[cart_viewed]' },
        { field: 'metrics.guardrails[errors].tolerance', before: '{ relative: 0.2 }', after: '{ relative: 2 }' },
        { field: 'decisions.loss', before: 'Drop and study.', after: 'Ship it anyway.' },
      ]),
    );
    expect(r.findings.find((f) => f.code === 'plan-end-moved')?.severity).toBe('warn');
    expect(r.verdict).toBe('blocked');
  });

  it('points at the first changed key, not the plan’s id: in the finding, the comment’s link and the annotation', async () => {
    const head = planYaml(cleanPlan({ window: { start: '2026-11-02', end: '2026-12-27' }, design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, alpha: 0.1 }, decisions: { win: 'Ship.', flat: 'Drop.', loss: 'Ship it anyway.', 'guardrail-breach': 'Stop.' } }));
    const lineOf = (start: string) => head.split('\n').findIndex((l) => l.trimStart().startsWith(start)) + 1;
    expect(lineOf('alpha:')).toBeLessThan(lineOf('loss:'));
    const r = await review(baseFiles(), { 'experiments/good.yaml': head });
    const frozen = r.findings.find((f) => f.code === 'plan-frozen')!;
    expect(frozen).toMatchObject({ file: 'experiments/good.yaml', line: lineOf('alpha:') });
    expect(r.findings.find((f) => f.code === 'plan-end-moved')).toMatchObject({ line: lineOf('end:') });
    expect(renderReviewMarkdown(r, { repoUrl: 'https://github.com/o/r' })).toContain(`experiments/good.yaml#L${lineOf('alpha:')}`);
    const annotation = planAnnotations(r, { notices: [], warnings: [] }).find((a) => a.properties.title === 'Plumbline plan-frozen');
    expect(annotation?.properties).toMatchObject({ file: 'experiments/good.yaml', startLine: lineOf('alpha:') });
  });

  it('without the base commit, names the started tests it could not compare (a few, then a count)', () => {
    const entry = (id: string, state: string) => ({ id, state, window: { start: '2026-11-02' }, owners: ['@a'], flags: [id], amendments: [], file: `experiments/${id}.yaml`, line: 1 });
    const entries = [...['a', 'b', 'c', 'd', 'e', 'f', 'g'].map((id) => entry(id, 'live')), entry('done', 'concluded')];
    const contextOf = (list: readonly { file: string }[], deleted: string[] = []) =>
      ({ baseUnreadable: 'no history was there', today: TODAY, registry: { entries: list }, changedPaths: list.map((e) => e.file), changedCode: deleted.map((path) => ({ path, basePath: path, added: [], removed: [1] })), baseEntries: [], invalidPlanFiles: [] }) as unknown as ReviewContext;
    const [found] = frozenPlans(contextOf(entries));
    expect(found!.message).toBe('The plans of 7 started tests this change edits (a, b, c, d, e and 2 more) were not compared with the base commit, so changes to what decides their results (plan-frozen, plan-amended, plan-end-moved) could not be checked. The base commit was not read because no history was there.');
    expect(frozenPlans(contextOf([entry('done', 'concluded')]))).toEqual([]);
    expect(frozenPlans(contextOf([], ['experiments/old.yaml', 'src/a.ts']))[0]!.message).toContain('This change deletes 1 YAML file (experiments/old.yaml); whether one held a started test');
  });

  it('freezes a draft whose start date has passed, but not one that starts later', async () => {
    const draft = (start: string) => cleanPlan({ state: 'draft', window: { start, end: '2026-12-27' } });
    const changeAlpha = (start: string) => ({ 'experiments/good.yaml': planYaml({ ...draft(start), design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, alpha: 0.1 } }) });
    expect(codes(await review(baseFiles({ 'experiments/good.yaml': planYaml(draft('2026-11-09')) }), changeAlpha('2026-11-09')))).toContain('plan-frozen');
    expect(codes(await review(baseFiles({ 'experiments/good.yaml': planYaml(draft('2026-11-30')) }), changeAlpha('2026-11-30')))).not.toContain('plan-frozen');
  });

  it('lets an amendment through as a note with a before/after table that GitHub renders', async () => {
    const amendment = { date: '2026-11-16', changed: 'alpha 0.05 -> 0.1', reason: 'A <b>second</b> look @team.' };
    const head = cleanPlan({ design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, alpha: 0.1 }, amendments: [amendment] });
    const r = await review(baseFiles(), { 'experiments/good.yaml': planYaml(head), 'src/cart.ts': CART_CODE_TOUCHED });
    expect(codes(r)).not.toContain('plan-frozen');
    const amended = r.findings.find((f) => f.code === 'plan-amended')!;
    expect(amended.severity).toBe('note');
    // At the amendment that explains the change.
    expect(amended.line).toBe(planYaml(head).split('\n').findIndex((l) => l.includes('- date: 2026-11-16')) + 1);
    expect(amended.amendment).toEqual(amendment);
    expect(amended.changes).toEqual([{ field: 'design.alpha', before: '0.05', after: '0.1' }]);
    const html = render(renderReviewMarkdown(r, {}));
    expect(html).toContain('<td><code>design.alpha</code></td>\n<td>0.05</td>\n<td>0.1</td>');
    expect(html).not.toContain('<b>');
  });

  it('blocks an amendment that rewrites earlier amendments (they are append-only)', async () => {
    const first = { date: '2026-11-09', changed: 'power 0.8 -> 0.9', reason: 'More traffic.' };
    const base = cleanPlan({ amendments: [first] });
    const head = cleanPlan({ amendments: [{ ...first, reason: 'Something else.' }, { date: '2026-11-16', changed: 'x', reason: 'y' }], design: { 'min-detectable-effect': { relative: 0.05 }, 'daily-units': 20000, alpha: 0.1 } });
    const r = await review(baseFiles({ 'experiments/good.yaml': planYaml(base) }), { 'experiments/good.yaml': planYaml(head) });
    expect(r.findings.find((f) => f.code === 'plan-frozen')?.changes?.map((c) => c.field)).toEqual(['design.alpha', 'amendments']);
  });

  it('treats registry entries the same way: a changed start blocks, deleting a live entry blocks', async () => {
    const registry = (start: string) =>
      `tests:\n  - id: partner-banner\n    title: Partner banner\n    owners: ['@partner']\n    state: live\n    flags: [partner-banner]\n    window: { start: ${start}, end: 2026-11-29 }\n    surface: { path: shop/banner }\n    events: [banner_seen]\n`;
    const files = baseFiles({ '.plumbline.yml': 'registries: [ops/tests.yaml]\n', 'ops/tests.yaml': registry('2026-11-02') });
    const moved = await review(files, { 'ops/tests.yaml': registry('2026-11-09') });
    expect(moved.findings.find((f) => f.code === 'plan-frozen')?.changes).toEqual([{ field: 'window.start', before: '2026-11-02', after: '2026-11-09' }]);
    // The entry's window line, not its id line.
    expect(moved.findings.find((f) => f.code === 'plan-frozen')?.line).toBe(7);
    const gone = await review(files, { 'ops/tests.yaml': 'tests: []\n' });
    expect(gone.findings.find((f) => f.code === 'plan-deleted')?.plan).toBe('partner-banner');
  });
});

describe('honest logging evidence', () => {
  const other = (event: string) =>
    planYaml(cleanPlan({ id: 'other', flags: ['other-flag'], owners: ['@owner-two'], surface: { path: 'shop/search' }, exposure: { event } }));
  const keeper = (extra: Record<string, string> = {}) => baseFiles({ 'experiments/other.yaml': other('keeper_seen'), 'src/keeper.ts': "analytics.track('keeper_seen');\n", ...extra });
  const removed = (r: Review) => r.findings.find((f) => f.code === 'event-removed');

  it('commenting out the only logging call removes the event', async () => {
    const r = await review(keeper(), { 'src/keeper.ts': "// analytics.track('keeper_seen');\n" });
    expect(removed(r)?.severity).toBe('block');
    expect(removed(r)?.dependents).toEqual(['other']);
  });

  it('a block comment, a Python comment and a test, a fixture or a document that still quote the name do not keep it', async () => {
    const r = await review(keeper({ 'src/search.py': 'def f():\n    pass\n' }), {
      'src/keeper.ts': '/*\n * analytics.track("keeper_seen");\n */\n',
      'src/search.py': "def f():\n    # track('keeper_seen')\n    pass\n",
      'test/keeper.test.ts': "expect(events).toContain('keeper_seen');\n",
      'src/__fixtures__/events.json': '["keeper_seen"]\n',
      'docs/tracking-plan.md': "| `keeper_seen` | logged when 'keeper_seen' shows |\n",
    });
    expect(removed(r)?.dependents).toEqual(['other']);
  });

  it('removing one of two logging calls is fine', async () => {
    const r = await review(keeper({ 'src/again.ts': "analytics.track(\n  'keeper_seen',\n  { again: true },\n);\n" }), { 'src/keeper.ts': '// moved to again.ts\n' });
    expect(removed(r)).toBeUndefined();
  });

  it('a dependent test is still named when the change also drops the event from its plan', async () => {
    const r = await review(keeper(), { 'src/keeper.ts': '\n', 'experiments/other.yaml': other('other_seen') });
    expect(removed(r)?.dependents).toEqual(['other']);
  });

  it('a logging call in a test file is mentioned, not logged', async () => {
    const r = await review(baseFiles(), { 'experiments/good.yaml': planYaml(cleanPlan({ exposure: { event: 'cart_seen' } })), 'test/cart.test.ts': "track('cart_seen');\n" });
    const status = r.plans[0]!.events.find((e) => e.event === 'cart_seen')!;
    expect(status.location).toBeUndefined();
    expect(status.mentionedAt).toMatchObject({ file: 'test/cart.test.ts', line: 1 });
    expect(r.findings.find((f) => f.code === 'event-missing')?.message).toContain('only mentioned, in test/cart.test.ts:1');
  });

  it('counts logging calls split over lines and written the way Go and C# write method names', async () => {
    const plan = cleanPlan({ exposure: { event: 'cart_seen' }, metrics: { primary: { name: 'bought', kind: 'proportion', baseline: { rate: 0.3 }, events: ['order_go'] }, guardrails: [{ name: 'errors', kind: 'proportion', baseline: { rate: 0.02 }, events: ['error_cs'], direction: 'decrease', tolerance: { relative: 0.2 } }] } });
    const r = await review(baseFiles(), {
      'experiments/good.yaml': planYaml(plan),
      'src/cart.ts': "export function cart(track) {\n  track(\n    'cart_seen',\n    { from: 'cart' },\n  );\n}\n",
      'svc/orders.go': 'func done(ctx context.Context) {\n\tanalytics.Track(ctx, "order_go")\n}\n',
      'svc/Errors.cs': 'public void Fail() {\n    telemetry.LogEvent("error_cs");\n}\n',
    });
    expect(Object.fromEntries(r.plans[0]!.events.map((e) => [e.event, `${e.via}:${e.location?.file}:${e.location?.line}`]))).toEqual({
      cart_seen: 'call:src/cart.ts:3',
      order_go: 'call:svc/orders.go:2',
      error_cs: 'call:svc/Errors.cs:2',
    });
  });

  it('sees a new flag evaluated in a call a formatter split over lines, and not one that is commented out', async () => {
    const r = await review(baseFiles(), {
      'src/new.ts': 'export const on = client.getBooleanValue(\n  "split-flag",\n  false,\n);\n// client.getBooleanValue("commented-flag", false);\n',
    });
    expect(r.flags.map((f) => `${f.key}:${f.line}`)).toEqual(['split-flag:2']);
    expect(r.findings.find((f) => f.code === 'flag-without-plan')?.message).toContain('split-flag');
  });
});

describe('a test ended early', () => {
  const hardCoded = CART_CODE.replace("if (client.getBooleanValue('good-flag', false)) {", 'if (true) {');
  it('blocks when the last read goes, naming the days left; a read left only in a comment or a test does not count', async () => {
    const r = await review(baseFiles(), { 'src/cart.ts': `${hardCoded}// client.getBooleanValue('good-flag', false)\n`, 'test/cart.test.ts': "client.getBooleanValue('good-flag', false);\n" });
    const ended = r.findings.find((f) => f.code === 'test-ended-early')!;
    expect(ended.severity).toBe('block');
    expect(ended.message).toContain('its planned end is 2026-11-29, 13 days away');
    expect(ended.dependents).toEqual(['good']);
  });

  it('still sees the last read removed when the base commit cannot be read (files-API mode): head’s started tests stand in', async () => {
    const repo = makeTwoCommitRepo(baseFiles(), { 'src/cart.ts': hardCoded });
    made.push(repo.root);
    const change = await openChange(repo.root, 'main', 'HEAD');
    const headFiles = change.filesAt('head');
    const unknown = { listFiles: async () => [], readText: async () => undefined, readTexts: async (paths: readonly string[]) => paths.map(() => undefined) };
    Object.assign(change, { baseUnreadable: 'no git history', filesAt: (side: 'base' | 'head') => (side === 'base' ? unknown : headFiles) });
    const outcome = await reviewChange({ change, today: TODAY });
    expect(outcome.kind === 'review' ? codes(outcome.review) : []).toContain('test-ended-early');
  });

  it('is quiet when another read of the flag remains', async () => {
    const r = await review(baseFiles({ 'src/banner.ts': "export const banner = (client) => client.getBooleanValue('good-flag', false);\n" }), { 'src/cart.ts': hardCoded });
    expect(codes(r)).not.toContain('test-ended-early');
  });
});

describe('exposure in every arm', () => {
  const plan = planYaml(cleanPlan());
  it('warns on an early return on the control value, quoting the lines, and unticks the checklist item', async () => {
    const code = "export function cart(client, track) {\n  const arm = client.getStringValue('good-flag', 'control');\n  if (arm === 'control') return;\n  track('cart_viewed');\n  track('order_done');\n  track('cart_error');\n}\n";
    const r = await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': code });
    const found = r.findings.find((f) => f.code === 'exposure-one-arm')!;
    expect(found).toMatchObject({ severity: 'warn', file: 'src/cart.ts', line: 4 });
    expect(found.message).toContain("line 3 `if (arm === 'control') return;`");
    expect(found.fix).toContain('in every arm, control included');
    expect(r.plans[0]!.checklist.find((i) => i.label.startsWith('Exposure'))?.done).toBe(false);
  });

  it('warns for the else branch and in Python; an unrelated branch is fine', async () => {
    const elseBranch = "export function cart(client, track) {\n  const on = client.getBooleanValue('good-flag', false);\n  if (on) {\n    track('order_done');\n  } else {\n    track('cart_viewed');\n  }\n  track('cart_error');\n}\n";
    expect(codes(await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': elseBranch }))).toContain('exposure-one-arm');
    const python = "def cart(client, track):\n    on = client.get_boolean_value('good-flag', False)\n    if not on:\n        return None\n    track('cart_viewed')\n    track('order_done')\n    track('cart_error')\n";
    expect(codes(await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': null, 'src/cart.py': python }))).toContain('exposure-one-arm');
    const unrelated = "export function cart(client, user, track) {\n  const on = client.getBooleanValue('good-flag', false);\n  if (user.isNew) {\n    track('cart_viewed');\n  }\n  track(on ? 'order_done' : 'cart_error');\n}\n";
    expect(codes(await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': unrelated }))).not.toContain('exposure-one-arm');
  });

  it('finds the read when its key is held in a constant or the call is split over lines (the flag finder’s own reads)', async () => {
    const constant = "const FLAG = 'good-flag';\nexport function cart(client, track) {\n  if (client.getBooleanValue(FLAG, false)) {\n    track('cart_viewed');\n  }\n  track('order_done');\n  track('cart_error');\n}\n";
    const found = (await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': constant })).findings.find((f) => f.code === 'exposure-one-arm');
    expect(found).toMatchObject({ file: 'src/cart.ts', line: 4 });
    expect(found!.message).toContain('line 3 `if (client.getBooleanValue(FLAG, false)) {`');
    const split = "export function cart(client, track) {\n  const on = client\n    .getBooleanValue(\n      'good-flag', false);\n  if (on) {\n    track('cart_viewed');\n  }\n  track('order_done');\n  track('cart_error');\n}\n";
    expect((await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': split })).findings.find((f) => f.code === 'exposure-one-arm')).toMatchObject({ file: 'src/cart.ts', line: 6 });
    const go = 'package cart\n\nconst Flag = "good-flag"\n\nfunc Cart(ctx context.Context, client *openfeature.Client) {\n\ton, _ := client.BooleanValue(ctx, Flag, false, evalCtx)\n\tif on {\n\t\tanalytics.Track(ctx, "cart_viewed")\n\t}\n\tanalytics.Track(ctx, "order_done")\n\tanalytics.Track(ctx, "cart_error")\n}\n';
    expect((await review(baseFiles(), { 'experiments/good.yaml': plan, 'src/cart.ts': null, 'src/cart.go': go })).findings.find((f) => f.code === 'exposure-one-arm')).toMatchObject({ file: 'src/cart.go', line: 8 });
  });
});

describe('treatment changed mid-test', () => {
  it('warns on a changed definition of a started test’s flag (a ramp), naming the owners', async () => {
    const flagsFile = (weight: number) => `{ "flags": { "good-flag": { "variants": { "on": true, "off": false }, "weights": { "on": ${weight}, "off": ${100 - weight} } } } }\n`;
    const r = await review(baseFiles({ 'config/flags.json': flagsFile(10) }), { 'config/flags.json': flagsFile(50) });
    const found = r.findings.find((f) => f.code === 'treatment-changed')!;
    expect(found).toMatchObject({ severity: 'warn', plan: 'good', file: 'config/flags.json' });
    expect(found.fix).toContain('@owner-one');
  });

  it('uses the configured number of lines for a read outside any function', async () => {
    const top = "const on = client.getBooleanValue('good-flag', false);\nconst a = 1;\nconst b = 2;\nconst c = 3;\n";
    const edited = top.replace('const c = 3;', 'const c = 4;');
    expect(codes(await review(baseFiles({ 'src/top.ts': top, '.plumbline.yml': 'treatment-lines: 3\n' }), { 'src/top.ts': edited }))).toContain('treatment-changed');
    expect(codes(await review(baseFiles({ 'src/top.ts': top, '.plumbline.yml': 'treatment-lines: 2\n' }), { 'src/top.ts': edited }))).not.toContain('treatment-changed');
  });
});

describe('smaller truths', () => {
  it('a flag whose plan does not load is "plan invalid", not "flag without plan"', async () => {
    const broken = planYaml(cleanPlan({ id: 'broken', flags: ['broken-flag'], design: { alpha: 2 } }));
    const r = await review(baseFiles({ 'experiments/broken.yaml': broken }), { 'src/new.ts': "client.getBooleanValue('broken-flag', false);\n" });
    expect(codes(r)).toContain('plan-invalid');
    expect(codes(r)).not.toContain('flag-without-plan');
    expect(r.findings.find((f) => f.code === 'plan-invalid')?.file).toBe('experiments/broken.yaml');
  });

  const other = (overrides: Record<string, unknown>) =>
    planYaml(cleanPlan({ id: 'other', flags: ['other-flag'], owners: ['@owner-two'], surface: { path: 'shop/cart/total' }, exposure: { event: 'order_done' }, ...overrides }));

  it('a known overlap says which side declared it', async () => {
    const r = await review(baseFiles({ 'experiments/other.yaml': other({ surface: { path: 'shop/cart', 'overlaps-with': ['good'] } }) }), { 'experiments/good.yaml': planYaml(cleanPlan({ title: 'Renamed' })) });
    expect(r.findings.find((f) => f.code === 'known-overlap')?.message).toContain('other declares the overlap; this plan does not.');
  });

  // Decided: only live tests count as running for collisions. An on-hold test exposes no one while it waits;
  // a concluded one is over. (The digest lists tests on hold too long so they do not hold a surface forever.)
  it.each([
    ['live', true],
    ['on-hold', false],
    ['concluded', false],
  ])('a collision with a %s test: %s', async (state, expected) => {
    const r = await review(baseFiles({ 'experiments/other.yaml': other({ state }) }), { 'experiments/good.yaml': planYaml(cleanPlan({ title: 'Renamed' })) });
    expect(codes(r).includes('collision')).toBe(expected);
  });
});
