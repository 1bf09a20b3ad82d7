import picomatch from 'picomatch';

/**
 * A test for paths against globs, compiled once to plain regular expressions. picomatch's own
 * matcher re-formats every path and tries each glob through a wrapper, ten times the cost of the
 * expressions themselves over a 5,000-file tree; paths from git need none of that (no "./"
 * prefix, '/' separators), so the expressions are tested directly. Same options, same answers.
 */
export function globMatcher(globs: readonly string[], options: { dot: boolean }): (path: string) => boolean {
  const expressions = globs.map((glob) => picomatch.makeRe(glob, options));
  return (path) => {
    for (const expression of expressions) if (expression.test(path)) return true;
    return false;
  };
}

/** Which tracked files the code scan reads: those the include globs match and no exclude glob does. */
export function scanMatcher(scan: { include: readonly string[]; exclude: readonly string[] }): (path: string) => boolean {
  const include = globMatcher(scan.include, { dot: true });
  const exclude = globMatcher(scan.exclude, { dot: true });
  return (path) => include(path) && !exclude(path);
}
