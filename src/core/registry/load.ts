import { z } from 'zod';
import type { LoadedPlan } from '../plan/load.js';
import { renamedSurfaceKeys } from '../plan/renamed-keys.js';
import { checkWritten, type JsonSchemaNode } from '../source/check-written.js';
import type { Problem } from '../source/problem.js';
import { readYaml, type YamlLimits } from '../source/yaml-source.js';
import { entryFromPlan, registrySchema, writtenRegistrySchema, type RegistryEntry } from './schema.js';

/** Registry files may list many tests, but are still text written by people. */
export const REGISTRY_LIMITS: YamlLimits = { maxBytes: 4 * 1024 * 1024, maxAliases: 1000 };

let cachedJsonSchema: JsonSchemaNode | undefined;
export function registryJsonSchema(): JsonSchemaNode {
  cachedJsonSchema ??= {
    $id: 'https://plumbline.dev/schema/registry.schema.json',
    title: 'Plumbline registry file',
    ...(z.toJSONSchema(writtenRegistrySchema, { io: 'input', target: 'draft-2020-12' }) as JsonSchemaNode),
  };
  return cachedJsonSchema;
}

export type RegistryFileResult = { ok: true; entries: RegistryEntry[]; warnings: Problem[] } | { ok: false; errors: Problem[] };

/** Text of one registry file -> its entries, located line by line. */
export function loadRegistryFile(text: string, file: string): RegistryFileResult {
  const read = readYaml(text, file, REGISTRY_LIMITS, 'registry');
  if (!read.ok) return { ok: false, errors: read.problems };
  const checked = checkWritten(read.source, registrySchema, registryJsonSchema, 'registry');
  if (!checked.ok) return { ok: false, errors: checked.problems };
  const entries = checked.value.map((entry, index) => ({ ...entry, file, line: read.source.locate(['tests', index, 'id']).line, keyLines: read.source.keyLines(['tests', index]) }));
  const warnings = renamedSurfaceKeys(read.source, entries.map((_, index) => ['tests', index, 'surface']), 'registry');
  return { ok: true, entries, warnings };
}

/** All tests known to this repository. */
export interface Registry {
  entries: RegistryEntry[];
}

/**
 * Joins plans and registry-file entries into one registry. An id used twice is an error on the
 * later file (sorted by path), since collisions and digests key on ids.
 */
export function buildRegistry(plans: readonly LoadedPlan[], extra: readonly RegistryEntry[]): { registry: Registry; problems: Problem[] } {
  const candidates = [...plans.map((p) => entryFromPlan(p.plan, p.file, p.line, p.keyLines)), ...extra].sort(
    // Code-unit order, not localeCompare: the same in every locale, and no collator to load at start.
    (a, b) => (a.file < b.file ? -1 : a.file > b.file ? 1 : a.line - b.line),
  );
  const byId = new Map<string, RegistryEntry>();
  const problems: Problem[] = [];
  for (const entry of candidates) {
    const first = byId.get(entry.id);
    if (first) {
      problems.push({
        severity: 'error',
        code: 'registry/duplicate-id',
        file: entry.file,
        line: entry.line,
        column: 1,
        field: 'id',
        message: `id "${entry.id}" is already used by ${first.file}:${first.line}`,
        expected: 'an id unique across all plans and registry files',
      });
      continue;
    }
    byId.set(entry.id, entry);
  }
  return { registry: { entries: [...byId.values()] }, problems };
}
