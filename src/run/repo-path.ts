import { isAbsolute, relative, sep } from 'node:path';

/**
 * A path a user typed, as the repository's file reader takes it: relative to the repository root (`-C`).
 * An absolute path (files often live outside the repository) is made relative to the root, never joined onto it.
 */
export function pathInRepository(root: string, written: string): string {
  const path = isAbsolute(written) ? relative(root, written).split(sep).join('/') || '.' : written;
  return path.replace(/^\.\//, '');
}
