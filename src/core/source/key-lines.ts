import { formatFieldPath } from './check-written.js';
import type { FieldPath, YamlSource } from './yaml-source.js';

/**
 * Lines of every key (and list item) under `root` in a parsed file, by field path relative to `root`
 * (a registry file's `tests[2]` holds one entry); plans are small, so one walk is cheap.
 */
export function keyLinesOf(source: YamlSource, root: FieldPath = []): Map<string, number> {
  const lines = new Map<string, number>();
  const walk = (value: unknown, path: FieldPath) => {
    if (Array.isArray(value)) {
      value.forEach((item, index) => {
        lines.set(formatFieldPath([...path, index]), source.locate([...root, ...path, index]).line);
        walk(item, [...path, index]);
      });
    } else if (value !== null && typeof value === 'object') {
      for (const [key, item] of Object.entries(value)) {
        lines.set(formatFieldPath([...path, key]), source.locateKey([...root, ...path], key).line);
        walk(item, [...path, key]);
      }
    }
  };
  let value: unknown = source.value;
  for (const step of root) value = (value as Record<string | number, unknown> | undefined)?.[step];
  walk(value, []);
  return lines;
}
