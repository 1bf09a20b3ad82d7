import { valueAt, formatFieldPath } from '../source/check-written.js';
import type { Problem } from '../source/problem.js';
import type { FieldPath, YamlSource } from '../source/yaml-source.js';

/**
 * Keys that were renamed: files written with the old name still load, and each old key gets a
 * warning at the key itself that names the new one, so the file can be updated at leisure.
 */
interface RenamedKey {
  /** The mapping (relative to a surface) that holds the key. */
  old: string;
  replacement: string;
  how: string;
  example: string;
}

const SURFACE_RENAMES: readonly RenamedKey[] = [
  {
    old: 'exclusion-group',
    replacement: 'traffic-split',
    how: 'its slice: { from, to } is now range: { start, end }, with the same percent values',
    example: 'traffic-split: { name: checkout-core, range: { start: 0, end: 50 } }',
  },
];

/** Warnings for renamed keys under each surface in `surfaces` (paths to surface mappings). */
export function renamedSurfaceKeys(source: YamlSource, surfaces: readonly FieldPath[], codePrefix: string): Problem[] {
  const problems: Problem[] = [];
  for (const path of surfaces) {
    const surface = valueAt(source.value, path);
    if (!surface || typeof surface !== 'object' || Array.isArray(surface)) continue;
    for (const rename of SURFACE_RENAMES) {
      if (!(rename.old in surface)) continue;
      problems.push({
        severity: 'warning',
        code: `${codePrefix}/renamed-key`,
        ...source.locateKey(path, rename.old),
        field: formatFieldPath([...path, rename.old]),
        message: `"${rename.old}" is the old name of "${rename.replacement}" and is still read for now; rename it (${rename.how})`,
        expected: rename.example,
      });
    }
  }
  return problems;
}
