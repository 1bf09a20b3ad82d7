import picomatch from 'picomatch';

/** Which tracked files the code scan reads: those the include globs match and no exclude glob does. */
export function scanMatcher(scan: { include: readonly string[]; exclude: readonly string[] }): (path: string) => boolean {
  const include = picomatch([...scan.include], { dot: true });
  const exclude = scan.exclude.length ? picomatch([...scan.exclude], { dot: true }) : () => false;
  return (path) => include(path) && !exclude(path);
}
