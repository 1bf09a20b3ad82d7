import fc from 'fast-check';
import picomatch from 'picomatch';
import { describe, expect, it } from 'vitest';
import { DEFAULT_SCAN_EXCLUDE } from '../../src/core/config/schema.js';
import { globMatcher, scanMatcher } from '../../src/core/config/scan-files.js';
import { DEFAULT_FLAG_FILES } from '../../src/core/scan/flag-files.js';

// The reference is picomatch's own matcher, which the compiled expressions must agree with on any path git lists.
const GLOBS = [...DEFAULT_SCAN_EXCLUDE, ...DEFAULT_FLAG_FILES, '**', 'src/**', 'src/*.ts', '**/fixtures/**', '{a,b}/**/*.js', '!(x)/y', '**/.hidden/**', 'docs/*.md'];
const segment = fc.oneof(
  fc.constantFrom('node_modules', 'dist', 'build', 'vendor', 'src', 'a', 'b', 'x', 'y', 'fixtures', '.hidden', '.git', 'docs', 'flags.json', 'app.flags.yml', 'lib.min.js', 'x.map', 'file.ts', 'README.md', 'caf\u00e9.ts'),
  fc.stringMatching(/^[a-z.]{1,6}$/),
);
const path = fc.array(segment, { minLength: 1, maxLength: 5 }).map((parts) => parts.join('/'));

describe('globMatcher', () => {
  it.each(GLOBS)('agrees with picomatch on %s', (glob) => {
    const ours = globMatcher([glob], { dot: true });
    const reference = picomatch(glob, { dot: true });
    fc.assert(fc.property(path, (p) => ours(p) === reference(p)), { numRuns: 400 });
  });

  it('matches when any glob matches, as picomatch does with a list', () => {
    const ours = globMatcher(GLOBS, { dot: true });
    const reference = picomatch(GLOBS, { dot: true });
    fc.assert(fc.property(path, (p) => ours(p) === reference(p)), { numRuns: 1000 });
  });

  it('scans the default include minus the default exclude', () => {
    const inScope = scanMatcher({ include: ['**'], exclude: DEFAULT_SCAN_EXCLUDE });
    expect(['src/a.ts', 'x/node_modules/p/i.js', 'web/dist/app.js', 'a.min.js', 'b.js.map', '.github/workflows/ci.yml'].map(inScope)).toEqual([true, false, false, false, false, true]);
    expect(globMatcher([], { dot: true })('anything')).toBe(false);
  });
});
