import { globMatcher, scanMatcher } from '../core/config/scan-files.js';
import { declaredFlags } from '../core/plan/declared-flags.js';
import type { LoadedPlan } from '../core/plan/load.js';
import { eventsOfPlan } from '../core/registry/schema.js';
import { runningEntries } from '../core/checks/collisions.js';
import { buildReview, type Review } from '../core/review/build-review.js';
import type { ChangedCode, LinkedPlan, PullRequestInfo, ReviewContext } from '../core/review/context.js';
import { linkPlans } from '../core/review/link-plans.js';
import { parseUnifiedDiff, type FileDiff } from '../core/scan/diff.js';
import { DEFAULT_FLAG_FILES, flagDefinitionTouches, flagDefinitions } from '../core/scan/flag-files.js';
import { findFlagTouches, type FlagTouch } from '../core/scan/flag-touches.js';
import { createNameScanner, type Location, type NameHits } from '../core/scan/name-scan.js';
import { keptArm } from '../core/review/kept-arm.js';
import { QUOTED_STRING, flagPatternsOf, logPatternsOf } from '../core/scan/patterns.js';
import type { Problem } from '../core/source/problem.js';
import { latestByPlan } from './read-totals.js';
import { attachReadouts } from './review-readouts.js';
import { sizePlan } from '../core/stats/plan-sizing.js';
import { sizingPolicy } from '../core/config/sizing-policy.js';
import { finiteSizing } from '../core/stats/finite-sizing.js';
import type { ChangeSource, CommitFiles, ProgressReporter, RepoFiles } from '../ports.js';
import { todayIn } from './digest.js';
import { loadBaseWorkspace } from './load-base-plans.js';
import { loadWorkspace, ownFilesOf, type Workspace } from './load-workspace.js';

export interface ReviewChangeOptions {
  change: ChangeSource;
  settingsPath?: string;
  pr?: PullRequestInfo;
  onProgress?: ProgressReporter;
  /** The review's day, YYYY-MM-DD; default: today in the settings' time zone by the system clock. */
  today?: string;
  /** The repository's history: readouts apply the plan as it was at their plan-commit. Without it, today's plan, said so. */
  history?: CommitFiles;
  /** How the entry point names the two refs, e.g. `--base main` (default: `base` and `head` with short commit ids). */
  refNames?: { base: string; head: string };
}

/**
 * Head is an ancestor of the base ref and differs from it exactly when their merge base (the change's
 * `base`) is head itself while the base ref names another commit: no git process beyond the merge base.
 * Then the change is empty, and the review says the refs look swapped instead of passing in silence.
 */
function swappedRefs(change: ChangeSource, named: ReviewChangeOptions['refNames']): { base: string; head: string } | undefined {
  const { baseTip } = change;
  if (baseTip === undefined || change.base !== change.head || baseTip === change.head) return undefined;
  return named ?? { base: `base ${baseTip.slice(0, 7)}`, head: `head ${change.head.slice(0, 7)}` };
}

/**
 * The same review context with the linked plans and the registry as they were at the base commit,
 * so the review can tell findings this change introduces from ones that already held. The head's
 * settings, links and event locations are kept: the question is only whether each plan already had
 * the problem. Undefined when the base cannot be loaded (then every finding counts as introduced).
 */
async function contextAtBase(base: Workspace | undefined, baseFiles: RepoFiles, head: ReviewContext, removed: ReadonlyMap<string, Location>, history: CommitFiles | undefined): Promise<ReviewContext | undefined> {
  if (!base) return undefined;
  // Events whose logging this change removes were still there at base.
  const events = new Map(head.events);
  for (const [event, at] of removed) {
    const hits = events.get(event);
    if (!hits?.firstCall && !hits?.firstQuoted) events.set(event, { ...hits, first: at, firstQuoted: at });
  }
  const atBase = new Map(base.plans.map((p) => [p.plan.id, p]));
  const linked: LinkedPlan[] = head.linked.flatMap((l) => {
    const then = atBase.get(l.loaded.plan.id);
    return then ? [{ loaded: then, reasons: l.reasons, sizing: finiteSizing(sizePlan(then.plan, sizingPolicy(head.settings))) }] : [];
  });
  // A recorded outcome is checked against its totals at base too, so an unchanged override stays "known".
  await attachReadouts(linked, baseFiles, history ? { history } : {});
  return { ...head, linked, invalidPlanFiles: [], fileWarnings: base.problems.filter((p) => p.severity === 'warning'), registry: base.registry, events };
}

export type ReviewOutcome =
  | { kind: 'review'; review: Review; scanned: { files: number; bytes: number } }
  | { kind: 'settings-invalid'; settingsFile: string; problems: Problem[] };

/** Reviews the change from its merge base to head, reading plans, settings and code at head. */
export async function reviewChange(options: ReviewChangeOptions): Promise<ReviewOutcome> {
  const { change } = options;
  // Listing the tree, the diff and the base commit's plans run in git while head's plans load.
  const trackedAtHead = change.trackedFiles('head');
  const changedAndDiff = Promise.all([change.changedFiles(), change.diff()]);
  changedAndDiff.catch(() => undefined); // awaited below; this only keeps an early failure from counting as unhandled
  // Running tests are compared with their plans at the base commit.
  // Loaded once, for both: running tests' plans as they were, and the findings that already held.
  const baseWorkspace = change.baseUnreadable ? Promise.resolve(undefined) : loadBaseWorkspace(change, options.settingsPath);
  baseWorkspace.catch(() => undefined);
  const head = change.filesAt('head');
  const loaded = await loadWorkspace({ files: head, ...(options.settingsPath ? { settingsPath: options.settingsPath } : {}), ...(options.onProgress ? { onProgress: options.onProgress } : {}) });
  if (!loaded.ok) return { kind: 'settings-invalid', settingsFile: loaded.settingsFile, problems: loaded.settingsProblems };
  const { workspace } = loaded;
  const { settings } = workspace;
  // Without the base commit, head's started tests stand in, so the checks that read code at head still run.
  const baseEntries = change.baseUnreadable ? Promise.resolve(workspace.registry.entries) : baseWorkspace.then((w) => w?.registry.entries ?? []);
  baseEntries.catch(() => undefined);

  const [changed, diffText] = await changedAndDiff;
  const diffs = parseUnifiedDiff(diffText);
  const changedPaths = new Set(changed.filter((f) => f.status !== 'deleted').map((f) => f.path));

  // Texts of changed files on both sides: to resolve flag constants and to compare flag definition files.
  const textual = diffs.filter((d) => !d.binary);
  const headPaths = textual.filter((d) => changedPaths.has(d.path)).map((d) => d.path);
  const basePaths = textual.map((d) => d.previousPath ?? d.path);
  const [headTexts, baseTexts] = await Promise.all([head.readTexts(headPaths), change.filesAt('base').readTexts(basePaths)]);
  const textAt = { added: new Map(headPaths.map((p, i) => [p, headTexts[i]])), removed: new Map(basePaths.map((p, i) => [p, baseTexts[i]])) };

  const isFlagFile = globMatcher(DEFAULT_FLAG_FILES, { dot: true });
  const definitionTouches = changed
    .filter((f) => isFlagFile(f.path) || (f.previousPath !== undefined && isFlagFile(f.previousPath)))
    .flatMap((f) => flagDefinitionTouches(f.path, textAt.removed.get(f.previousPath ?? f.path), f.status === 'deleted' ? undefined : textAt.added.get(f.path)));
  const definedKeys = [...textAt.added.entries()].filter(([p]) => isFlagFile(p)).flatMap(([, text]) => [...(flagDefinitions(text)?.keys() ?? [])]);
  const knownKeys = new Set([...workspace.registry.entries.flatMap((e) => e.flags), ...settings.exemptFlags, ...definedKeys]);
  const flagPatterns = flagPatternsOf(settings);
  const codeTouches = findFlagTouches({
    diffs: textual.filter((d) => !isFlagFile(d.path)),
    patterns: flagPatterns,
    knownKeys,
    textOf: (side, path) => textAt[side].get(path),
  });
  const touches = [...definitionTouches, ...codeTouches];

  const pr = options.pr ?? {};
  const changedTotals = totalsInChange(textAt.added);
  const links = linkPlans({ plans: workspace.plans, changedPaths, touches, pr, readouts: new Set(changedTotals.keys()) });
  const linked: LinkedPlan[] = workspace.plans
    .filter((p) => links.has(p.plan.id))
    .map((p: LoadedPlan) => ({ loaded: p, reasons: links.get(p.plan.id)!, sizing: finiteSizing(sizePlan(p.plan, sizingPolicy(settings))) }));
  // Plan files that do not load: those the change edits, and those that name a flag the change touches.
  const brokenPlans = [...new Set(workspace.problems.filter((p) => p.severity === 'error' && workspace.planFiles.includes(p.file)).map((p) => p.file))];
  const brokenFlags = (await head.readTexts(brokenPlans)).map(declaredFlags);
  const touchedKeys = new Set(touches.map((t) => t.key));
  const invalidPlanFiles = brokenPlans
    .map((file, i) => ({ file, flags: brokenFlags[i]!, problems: workspace.problems.filter((p) => p.file === file) }))
    .filter((f) => changedPaths.has(f.file) || f.flags.some((k) => touchedKeys.has(k)));

  // One pass over the tracked code at head finds every event any linked or running plan names.
  // Running at head or at the base commit: a change that also edits the plan still cuts the data collected so far.
  const running = [...runningEntries(workspace.registry.entries), ...runningEntries(await baseEntries)];
  // The same pass finds whether the flags of started tests are still read anywhere.
  // Linked plans' flags too, concluded ones included: removing a flag's last read ends its test, and brings its readout.
  const startedFlags = [...[...workspace.registry.entries, ...(await baseEntries)].filter((e) => e.state !== 'concluded').flatMap((e) => e.flags), ...linked.flatMap((l) => l.loaded.plan.flags)];
  const names = [...new Set([...linked.flatMap((l) => eventsOfPlan(l.loaded.plan)), ...running.flatMap((e) => e.events), ...startedFlags])];
  const logPatterns = logPatternsOf(settings);
  const scanner = createNameScanner(names, logPatterns);
  if (names.length) {
    const ownFiles = ownFilesOf(workspace);
    const inScope = scanMatcher(settings.scan);
    // Flag definition files declare keys; they neither read a flag nor log an event.
    const paths = (await trackedAtHead).filter((p) => !ownFiles.has(p) && !isFlagFile(p) && inScope(p));
    let done = 0;
    await change.streamFiles('head', paths, (path, bytes) => {
      scanner.scanFile(path, bytes);
      options.onProgress?.(++done, paths.length, 'files');
    });
  }

  // Events that the change deletes from a line: those of running tests (event-removed), and those of
  // linked plans, which were still logged at base (so an event-missing they cause is not "already known").
  const runningEvents = new Set(running.flatMap((e) => e.events));
  const linkedEvents = new Set(linked.flatMap((l) => eventsOfPlan(l.loaded.plan)));
  const removedEvents = new Map<string, Location>();
  const removedLinked = new Map<string, Location>();
  for (const diff of textual) {
    for (const { line, text } of diff.removed) {
      for (const match of text.matchAll(QUOTED_STRING)) {
        const event = match[2]!;
        const at = { file: diff.previousPath ?? diff.path, line, column: match.index + 2 };
        if (runningEvents.has(event) && !removedEvents.has(event)) removedEvents.set(event, at);
        if (linkedEvents.has(event) && !removedLinked.has(event)) removedLinked.set(event, at);
      }
    }
  }

  const hits = scanner.results();
  const changedCode = changedCodeOf(textual, textAt);
  markEndings(linked, touches, hits, changedCode, flagPatterns);
  await attachReadouts(linked, head, { changedTotals, tracked: await trackedAtHead, ...(options.history ? { history: options.history } : {}) });
  // Code at head for the checks that read whole functions: changed files, and where linked plans log exposure.
  const codeAtHead = new Map([...textAt.added].filter((entry): entry is [string, string] => entry[1] !== undefined));
  const exposureFiles = [...new Set(linked.flatMap((l) => (l.loaded.plan.exposure.event ? [hits.get(l.loaded.plan.exposure.event)?.firstCall?.file] : [])))].filter((f): f is string => f !== undefined && !codeAtHead.has(f));
  (await head.readTexts(exposureFiles)).forEach((text, i) => text !== undefined && codeAtHead.set(exposureFiles[i]!, text));
  const context: ReviewContext = {
    settings, pr, linked, invalidPlanFiles, fileWarnings: workspace.problems.filter((p) => p.severity === 'warning'), changedPaths: [...changedPaths], touches, registry: workspace.registry, events: hits, flagsAtHead: hits, codeAtHead, removedEvents,
    changedCode, ...(change.baseUnreadable ? { baseUnreadable: change.baseUnreadable } : {}), today: options.today ?? todayIn(settings.digest.timeZone, new Date()), baseEntries: await baseEntries,
  };
  const baseContext = await contextAtBase(await baseWorkspace, change.filesAt('base'), context, removedLinked, options.history);
  const swapped = swappedRefs(change, options.refNames);
  const review = buildReview(context, { base: change.base, head: change.head, ...(swapped ? { swapped } : {}) }, baseContext);
  const stats = scanner.stats();
  return { kind: 'review', review, scanned: { files: stats.files, bytes: stats.bytes } };
}

/** Totals files the change adds or edits, by the plan they name (the latest data when a plan has several). */
function totalsInChange(added: ReadonlyMap<string, string | undefined>): Map<string, string> {
  const latest = latestByPlan([...added].map(([file, text]) => ({ file, text })));
  return new Map([...latest].map(([id, { file }]) => [id, file]));
}

/**
 * Linked plans whose flags the change stops reading: a read (a call, not a mention) removed, and no
 * quoted key left in product code at head. Those tests end with this change; which arm it keeps is read from the code.
 */
function markEndings(linked: LinkedPlan[], touches: readonly FlagTouch[], hits: ReadonlyMap<string, NameHits>, code: readonly ChangedCode[], flagPatterns: readonly RegExp[]): void {
  const removed = touches.filter((t) => t.side === 'removed' && (t.via === 'call' || t.via === 'constant'));
  for (const l of linked) {
    const { plan } = l.loaded;
    const gone = plan.flags.filter((k) => removed.some((t) => t.key === k) && hits.get(k)?.firstCall === undefined && hits.get(k)?.firstQuoted === undefined);
    if (gone.length === 0) continue;
    const reads = removed.filter((t) => gone.includes(t.key)).map((t) => ({ file: t.file, line: t.line }));
    l.ending = { flags: gone, kept: keptArm(plan, reads, code, flagPatterns) };
  }
}

/** The changed text files with their changed lines and both texts, for checks that read around a change. */
function changedCodeOf(diffs: readonly FileDiff[], textAt: { added: Map<string, string | undefined>; removed: Map<string, string | undefined> }): ChangedCode[] {
  return diffs.map((d) => {
    const basePath = d.previousPath ?? d.path;
    const head = textAt.added.get(d.path);
    const base = textAt.removed.get(basePath);
    return { path: d.path, basePath, added: d.added.map((l) => l.line), removed: d.removed.map((l) => l.line), ...(head !== undefined ? { head } : {}), ...(base !== undefined ? { base } : {}) };
  });
}
