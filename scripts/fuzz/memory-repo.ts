import type { ChangedFile, ChangeSource, RepoFiles } from '../../src/ports.js';

/** A repository's files in memory: path -> text. */
export type FileMap = ReadonlyMap<string, string>;

const clean = (path: string) => path.replace(/^\.\//, '').replace(/\/+$/, '');

/** RepoFiles over a map, with the folder semantics of the real adapter. */
export function memoryFiles(files: FileMap): RepoFiles {
  return {
    async listFiles(folder) {
      const prefix = clean(folder);
      return [...files.keys()].filter((p) => prefix === '' || prefix === '.' || p === prefix || p.startsWith(`${prefix}/`)).sort();
    },
    async readText(path) {
      return files.get(clean(path));
    },
    async readTexts(paths) {
      return paths.map((p) => files.get(clean(p)));
    },
  };
}

/** `git diff --unified=0` of one file, each side replaced whole (a valid diff, as git would print for a rewrite). */
function fileDiff(path: string, before: string | undefined, after: string | undefined): string {
  const lines = (text: string | undefined) => (text === undefined || text === '' ? [] : text.replace(/\n$/, '').split('\n'));
  const old = lines(before);
  const now = lines(after);
  const header = [`diff --git a/${path} b/${path}`, before === undefined ? 'new file mode 100644' : after === undefined ? 'deleted file mode 100644' : '', `--- ${before === undefined ? '/dev/null' : `a/${path}`}`, `+++ ${after === undefined ? '/dev/null' : `b/${path}`}`].filter(Boolean);
  const hunk = `@@ -${old.length ? 1 : 0},${old.length} +${now.length ? 1 : 0},${now.length} @@`;
  return [...header, hunk, ...old.map((l) => `-${l}`), ...now.map((l) => `+${l}`)].join('\n');
}

/** A change between two trees held in memory, shaped as the git adapter gives it. */
export function memoryChange(base: FileMap, head: FileMap): ChangeSource {
  const paths = [...new Set([...base.keys(), ...head.keys()])].sort();
  const changed: ChangedFile[] = paths
    .filter((p) => base.get(p) !== head.get(p))
    .map((p) => ({ path: p, status: !base.has(p) ? 'added' : !head.has(p) ? 'deleted' : 'modified' }));
  const side = (s: 'base' | 'head') => (s === 'base' ? base : head);
  return {
    base: 'b'.repeat(40),
    head: 'a'.repeat(40),
    async changedFiles() {
      return changed;
    },
    async diff() {
      return changed.map((f) => fileDiff(f.path, base.get(f.path), head.get(f.path))).join('\n');
    },
    filesAt: (s) => memoryFiles(side(s)),
    async streamFiles(s, wanted, onFile) {
      for (const p of wanted) {
        const text = side(s).get(p);
        if (text !== undefined) onFile(p, Buffer.from(text, 'utf8'));
      }
    },
    async trackedFiles(s) {
      return [...side(s).keys()].sort();
    },
  };
}
