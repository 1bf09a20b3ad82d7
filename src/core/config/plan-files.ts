import picomatch from 'picomatch';

const PLAN_EXTENSIONS = ['.yaml', '.yml'];

/** A folder to list and a test for which of its files are plan files. */
export interface PlanSearchRoot {
  folder: string;
  matches(path: string): boolean;
}

/**
 * Turns the settings' `plans` entries into folders to list: a glob is listed from its static
 * prefix and filtered by the glob; a plain path is a folder whose .yaml/.yml files are plans,
 * or a single plan file.
 */
export function planSearchRoots(entries: readonly string[]): PlanSearchRoot[] {
  return entries.map((raw) => {
    const entry = raw.replace(/^\.\//, '').replace(/\/+$/, '');
    const scan = picomatch.scan(entry);
    if (scan.isGlob) {
      const matcher = picomatch(entry, { dot: false });
      return { folder: scan.base, matches: (path) => isYamlFile(path) && matcher(path) };
    }
    if (isYamlFile(entry)) {
      const parent = entry.includes('/') ? entry.slice(0, entry.lastIndexOf('/')) : '';
      return { folder: parent, matches: (path) => path === entry };
    }
    const prefix = entry === '' || entry === '.' ? '' : `${entry}/`;
    return { folder: entry === '.' ? '' : entry, matches: (path) => path.startsWith(prefix) && isYamlFile(path) };
  });
}

function isYamlFile(path: string): boolean {
  return PLAN_EXTENSIONS.some((ext) => path.toLowerCase().endsWith(ext));
}
