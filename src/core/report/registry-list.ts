import type { Registry } from '../registry/load.js';
import type { RegistryEntry } from '../registry/schema.js';
import type { PlanState } from '../plan/schema.js';
import { formatTable, terminalSafe, terminalStyle } from './terminal-style.js';
import { noPlanFilesHint } from './validation.js';

/** Live tests first: they are the ones that can collide with a change today. */
const STATE_ORDER: Record<PlanState, number> = { live: 0, 'on-hold': 1, draft: 2, concluded: 3 };

export function sortEntries(entries: readonly RegistryEntry[]): RegistryEntry[] {
  return [...entries].sort(
    (a, b) =>
      STATE_ORDER[a.state] - STATE_ORDER[b.state] ||
      (a.window.start ?? '9999').localeCompare(b.window.start ?? '9999') ||
      a.id.localeCompare(b.id),
  );
}

export function formatWindow(window: { start?: string; end?: string }): string {
  if (!window.start && !window.end) return 'not set';
  return `${window.start ?? '?'} to ${window.end ?? 'open'}`;
}

export const REGISTRY_JSON_FORMAT = 'plumbline.registry/1';

export function registryJson(registry: Registry): object {
  return {
    format: REGISTRY_JSON_FORMAT,
    tests: sortEntries(registry.entries).map((e) => ({
      id: e.id,
      title: e.title,
      state: e.state,
      surface: e.surface.path,
      ...(e.surface.trafficSplit ? { trafficSplit: e.surface.trafficSplit } : {}),
      window: e.window,
      owners: e.owners,
      flags: e.flags,
      trafficShare: e.trafficShare,
      events: e.events,
      file: e.file,
      line: e.line,
    })),
  };
}

/** `noPlanFiles`: the repository holds no plan file at all (not merely none in the state asked for); say where to start. */
export function renderRegistryText(registry: Registry, options: { color: boolean; skippedFiles: number; noPlanFiles?: { settingsFile?: string } }): string {
  const style = terminalStyle(options.color);
  const entries = sortEntries(registry.entries);
  const rows = entries.map((e) =>
    [e.id, e.state, e.surface.path, formatWindow(e.window), e.owners.join(', '), `${e.file}:${e.line}`].map(terminalSafe),
  );
  const out = entries.length ? [formatTable(['ID', 'STATE', 'SURFACE', 'WINDOW', 'OWNERS', 'FILE'], rows)] : ['The registry is empty.'];
  const byState = (['live', 'on-hold', 'draft', 'concluded'] as const)
    .map((s) => [s, entries.filter((e) => e.state === s).length] as const)
    .filter(([, n]) => n > 0)
    .map(([s, n]) => `${n} ${s}`);
  out.push(style.dim(`${entries.length} test${entries.length === 1 ? '' : 's'}${byState.length ? `: ${byState.join(', ')}` : ''}.`));
  if (options.noPlanFiles && entries.length === 0) out.push(style.yellow(noPlanFilesHint(options.noPlanFiles.settingsFile)));
  if (options.skippedFiles) {
    out.push(style.yellow(`${options.skippedFiles} file${options.skippedFiles === 1 ? '' : 's'} with errors left out; run plumbline validate.`));
  }
  return out.join('\n');
}
