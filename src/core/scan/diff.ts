/**
 * Parses `git diff --unified=0` output into the lines each file gained and lost, with their line
 * numbers on each side. Binary files are marked and carry no lines.
 */
export interface DiffLine {
  line: number;
  text: string;
}

export interface FileDiff {
  path: string;
  previousPath?: string;
  added: DiffLine[];
  removed: DiffLine[];
  binary: boolean;
}

const HUNK = /^@@ -(\d+)(?:,\d+)? \+(\d+)(?:,\d+)? @@/;

/** Undoes git's C-style quoting of unusual paths ("a/caf\303\251.ts"). */
function unquote(path: string): string {
  if (!path.startsWith('"')) return path;
  const bytes: number[] = [];
  const body = path.slice(1, -1);
  for (let i = 0; i < body.length; i++) {
    const c = body[i]!;
    if (c !== '\\') {
      bytes.push(...Buffer.from(c, 'utf8'));
      continue;
    }
    const next = body[++i]!;
    if (/[0-7]/.test(next)) {
      bytes.push(parseInt(body.slice(i, i + 3), 8));
      i += 2;
    } else bytes.push(({ n: 10, t: 9, '"': 34, '\\': 92 } as Record<string, number>)[next] ?? next.charCodeAt(0));
  }
  return Buffer.from(bytes).toString('utf8');
}

function stripPrefix(path: string, prefix: string): string {
  const plain = unquote(path);
  return plain.startsWith(prefix) ? plain.slice(prefix.length) : plain;
}

export function parseUnifiedDiff(text: string): FileDiff[] {
  const files: FileDiff[] = [];
  let current: FileDiff | undefined;
  let oldLine = 0;
  let newLine = 0;
  for (const raw of text.split('\n')) {
    if (raw.startsWith('diff --git ')) {
      current = { path: '', added: [], removed: [], binary: false };
      files.push(current);
      continue;
    }
    if (!current) continue;
    if (raw.startsWith('--- ')) {
      const from = raw.slice(4);
      if (from !== '/dev/null') current.previousPath = stripPrefix(from, 'a/');
      continue;
    }
    if (raw.startsWith('+++ ')) {
      const to = raw.slice(4);
      current.path = to === '/dev/null' ? (current.previousPath ?? '') : stripPrefix(to, 'b/');
      if (current.previousPath === current.path) delete current.previousPath;
      continue;
    }
    if (raw.startsWith('rename from ')) {
      current.previousPath = unquote(raw.slice('rename from '.length));
      continue;
    }
    if (raw.startsWith('rename to ')) {
      current.path = unquote(raw.slice('rename to '.length));
      continue;
    }
    if (raw.startsWith('Binary files ')) {
      current.binary = true;
      const match = / and (?:b\/)?(.+) differ$/.exec(raw);
      if (match && !current.path) current.path = match[1] === '/dev/null' ? '' : match[1]!;
      continue;
    }
    const hunk = HUNK.exec(raw);
    if (hunk) {
      oldLine = Number(hunk[1]);
      newLine = Number(hunk[2]);
      continue;
    }
    if (raw.startsWith('+')) current.added.push({ line: newLine++, text: raw.slice(1) });
    else if (raw.startsWith('-')) current.removed.push({ line: oldLine++, text: raw.slice(1) });
    else if (raw.startsWith(' ')) {
      // A context line (patches from GitHub's API carry three around each change).
      oldLine++;
      newLine++;
    }
  }
  return files.filter((f) => f.path !== '');
}
