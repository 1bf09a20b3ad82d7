import { addDays, daysBetween, inclusiveDays } from '../calendar.js';
import { findCollisions, runningEntries } from '../checks/collisions.js';
import type { Settings } from '../config/schema.js';
import type { Registry } from '../registry/load.js';
import type { RegistryEntry } from '../registry/schema.js';
import type { Location } from '../scan/name-scan.js';
import { countOf } from '../report/numbers.js';
import { sizePlan } from '../stats/plan-sizing.js';
import { finiteSizing } from '../stats/finite-sizing.js';

/**
 * The weekly digest: the states of the registry that need someone's attention, as of `today`
 * (a calendar date in the settings' time zone, supplied by the caller: the core has no clock).
 */
export type DigestItemKind = 'overdue' | 'ending-soon' | 'draft-past-start' | 'long-on-hold' | 'flag-gone' | 'collision' | 'outcome-missing' | 'concluded-flag-in-code';

export interface DigestItem {
  kind: DigestItemKind;
  test: string;
  title: string;
  file: string;
  line: number;
  /** One sentence for the reader. */
  detail: string;
  daysOverdue?: number;
  /** Overdue tests: whether the planned sample is estimated to be in (from daily-units); undefined when unknown. */
  sampleReached?: boolean;
  /** Concluded tests whose flag is still read: whole days since the outcome's date (else the planned end). */
  daysSinceConclusion?: number;
  /** outcome-missing: the test is past its planned end, so its readout is due (not only a line saying why it stopped). */
  readoutDue?: boolean;
}

/** One test in the digest: who owns it and every item about it. */
export interface DigestTest {
  id: string;
  title: string;
  owners: string[];
  file: string;
  line: number;
  items: DigestItem[];
}

export interface Digest {
  today: string;
  counts: Record<DigestItemKind, number> & { live: number; planned: number; orphanFlags: number };
  /** Each test that needs attention once, with its owners and what needs doing, most urgent first. */
  tests: DigestTest[];
  /** Flag keys evaluated in code that no plan and no exemption covers. */
  orphanFlags: { key: string; location: Location }[];
  /** Live and planned tests with dates, for the timeline. */
  timeline: { id: string; surface: string; start: string; end: string; state: string; overdue: boolean }[];
}

export interface DigestInput {
  registry: Registry;
  today: string;
  settings: Settings;
  /** Where each flag key is evaluated in the code (first place), for every key found. */
  flagsInCode: ReadonlyMap<string, Location>;
}

function estimateSampleReached(entry: RegistryEntry, today: string): boolean | undefined {
  if (!entry.plan || !entry.window.start) return undefined;
  const sizing = finiteSizing(sizePlan(entry.plan)).metrics[0];
  const headline = sizing?.result.ok ? sizing.result.value.headline : undefined;
  const daily = entry.plan.design.dailyUnits;
  if (!headline || daily === undefined) return undefined;
  const end = entry.window.end && entry.window.end < today ? entry.window.end : today;
  const days = Math.max(0, inclusiveDays(entry.window.start, end));
  // The headline analysis counts exposed units; reach is already inside its size.
  const enrolled = days * daily * entry.plan.design.trafficShare;
  return enrolled >= headline.totalUnits;
}

export function buildDigest(input: DigestInput): Digest {
  const { registry, today, settings } = input;
  const items: DigestItem[] = [];
  const item = (entry: RegistryEntry, kind: DigestItemKind, detail: string, extra: Partial<DigestItem> = {}) =>
    items.push({ kind, test: entry.id, title: entry.title, file: entry.file, line: entry.line, detail, ...extra });
  const soon = addDays(today, settings.digest.endingSoonDays);

  for (const entry of registry.entries) {
    const { start, end } = entry.window;
    if (entry.state === 'live' && end && end < today) {
      const days = daysBetween(end, today);
      const reached = estimateSampleReached(entry, today);
      const advice = reached === true ? 'the planned sample should be in: read it out and decide' : reached === false ? 'the planned sample is not in yet by the plan’s own traffic estimate: decide whether to extend the plan or stop' : 'read it out, or extend the plan with a reason';
      item(entry, 'overdue', `Past its planned end (${end}) by ${countOf(days, 'day')}; ${advice}.`, { daysOverdue: days, ...(reached !== undefined ? { sampleReached: reached } : {}) });
    } else if (entry.state === 'live' && end && end >= today && end <= soon) {
      item(entry, 'ending-soon', `Ends on ${end}, in ${countOf(daysBetween(today, end), 'day')}: prepare the readout.`);
    }
    if (entry.state === 'draft' && start && start < today) {
      item(entry, 'draft-past-start', `Planned to start on ${start} but still a draft: launch it, move the window, or drop it.`);
    }
    if (entry.state === 'on-hold' && start && daysBetween(start, today) > settings.digest.onHoldDays) {
      item(entry, 'long-on-hold', `On hold, ${countOf(daysBetween(start, today), 'day')} after its start: its units and surface stay reserved; resume or conclude it.`);
    }
    // A test that is over (concluded, or on hold past its end) still owes its outcome: the decision and why.
    if (entry.plan && !entry.plan.outcome && (entry.state === 'concluded' || (entry.state === 'on-hold' && end && end < today))) {
      // Past the planned end the data is all in: the readout is what is owed, not only a line of reasons.
      const due = end !== undefined && end < today;
      const what = entry.state === 'concluded' ? `Concluded${due ? `, past its planned end (${end})` : ''}` : `On hold past its planned end (${end})`;
      const fix = due
        ? `read it out against its plan (plumbline readout ${entry.id} --totals <file> --record), or, if it ended without data, add outcome: { date, reason }.`
        : 'add outcome: { date, reason } with the decision in one line.';
      item(entry, 'outcome-missing', `${what}, but no outcome is recorded: ${fix}`, { readoutDue: due });
    }
    // Dead code waiting: the losing arm stays in the product, and the flag can be flipped by mistake.
    const stillRead = entry.flags.filter((f) => input.flagsInCode.has(f));
    if (entry.plan && entry.state === 'concluded' && stillRead.length) {
      const since = entry.plan.outcome?.date ?? entry.plan.outcome?.['recorded-on'] ?? end;
      const days = since !== undefined && since <= today ? daysBetween(since, today) : undefined;
      const where = input.flagsInCode.get(stillRead[0]!)!;
      item(
        entry,
        'concluded-flag-in-code',
        `Concluded${days !== undefined ? ` ${days} day${days === 1 ? '' : 's'} ago (${since})` : ''}, but its flag${stillRead.length === 1 ? '' : 's'} ${stillRead.join(', ')} ${stillRead.length === 1 ? 'is' : 'are'} still read in the code (${where.file}:${where.line}): remove the flag and the code of the arm that lost.`,
        days !== undefined ? { daysSinceConclusion: days } : {},
      );
    }
    // Only plans of this repository: a registry file's tests evaluate their flags in other code.
    if (entry.plan && entry.state === 'live' && entry.flags.length && entry.flags.every((f) => !input.flagsInCode.has(f))) {
      item(entry, 'flag-gone', `Live, but its flag${entry.flags.length === 1 ? '' : 's'} ${entry.flags.join(', ')} no longer appear${entry.flags.length === 1 ? 's' : ''} in the code: conclude the plan or restore the flag.`);
    }
  }

  const running = runningEntries(registry.entries);
  const seen = new Set<string>();
  for (const entry of running) {
    for (const c of findCollisions(entry, running)) {
      const pair = [entry.id, c.other.id].sort().join(' ');
      if (seen.has(pair) || c.known) continue;
      seen.add(pair);
      item(entry, 'collision', `Runs on ${entry.surface.path} alongside ${c.other.id} (${c.other.owners.join(', ')}) on ${c.other.surface.path}${c.overlapDays !== undefined ? ` for ${countOf(c.overlapDays, 'day')}` : ''}, with about ${Math.round(c.trafficShare * 100)}% of units in both.`);
    }
  }

  const covered = new Set([...registry.entries.flatMap((e) => e.flags), ...settings.exemptFlags]);
  const orphanFlags = [...input.flagsInCode].filter(([key]) => !covered.has(key)).map(([key, location]) => ({ key, location })).sort((a, b) => a.key.localeCompare(b.key));

  const ORDER: DigestItemKind[] = ['overdue', 'outcome-missing', 'flag-gone', 'collision', 'concluded-flag-in-code', 'draft-past-start', 'long-on-hold', 'ending-soon'];
  const byTest = new Map<string, DigestTest>();
  for (const it of items.sort((a, b) => ORDER.indexOf(a.kind) - ORDER.indexOf(b.kind) || a.test.localeCompare(b.test))) {
    const entry = registry.entries.find((e) => e.id === it.test)!;
    const test = byTest.get(it.test) ?? { id: entry.id, title: entry.title, owners: entry.owners, file: entry.file, line: entry.line, items: [] };
    test.items.push(it);
    byTest.set(it.test, test);
  }
  const counts = {
    overdue: 0,
    'ending-soon': 0,
    'draft-past-start': 0,
    'long-on-hold': 0,
    'flag-gone': 0,
    collision: 0,
    'outcome-missing': 0,
    'concluded-flag-in-code': 0,
    live: running.length,
    planned: registry.entries.filter((e) => e.state === 'draft').length,
    orphanFlags: orphanFlags.length,
  };
  for (const it of items) counts[it.kind]++;
  const timeline = registry.entries
    .filter((e) => (e.state === 'live' || e.state === 'draft' || e.state === 'on-hold') && e.window.start && e.window.end)
    .map((e) => ({ id: e.id, surface: e.surface.path, start: e.window.start!, end: e.window.end!, state: e.state, overdue: e.state === 'live' && e.window.end! < today }))
    .sort((a, b) => a.surface.localeCompare(b.surface) || a.start.localeCompare(b.start));
  return {
    today,
    counts,
    // Insertion order is urgency order: a test comes where its most urgent item sorted.
    tests: [...byTest.values()],
    orphanFlags,
    timeline,
  };
}
