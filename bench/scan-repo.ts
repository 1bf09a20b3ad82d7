// Generates (once, cached under .bench/) a git repository of at least 5,000 files and 50 MB of
// TypeScript-like code, with event names to search for: some logged, some absent, some that
// occur only inside a longer name.
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const VERSION = 'scan-repo-v2';
export const FILES = 5200;
const WORDS = ['cart', 'order', 'basket', 'slot', 'search', 'tip', 'wallet', 'promo', 'profile', 'invite', 'review', 'refund', 'rating', 'delivery', 'voucher', 'account'];

function random(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 4294967296;
  };
}

/** 2,000 names: "ev_<a>_<b>_<n>"; every fifth also has a longer twin "<name>_done" and only the twin is logged. */
export function eventNames(count: number): string[] {
  const names: string[] = [];
  for (let i = 0; names.length < count; i++) {
    const base = `ev_${WORDS[i % WORDS.length]}_${WORDS[(i * 7) % WORDS.length]}_${i}`;
    names.push(base);
  }
  return names;
}

export interface ScanRepo {
  root: string;
  names: Record<50 | 500 | 2000, string[]>;
  bytes: number;
}

/**
 * A tree given on the command line (a git repository): its names are string literals sampled
 * from its own code, plus absent names and names that only occur inside others.
 */
export function givenTree(root: string): ScanRepo {
  const tracked = execFileSync('git', ['ls-files', '-z'], { cwd: root, encoding: 'utf8', maxBuffer: 1 << 28 }).split('\0').filter(Boolean);
  const found = new Set<string>();
  let bytes = 0;
  for (const path of tracked) {
    let text: string;
    try {
      text = readFileSync(join(root, path), 'utf8');
    } catch {
      continue;
    }
    bytes += Buffer.byteLength(text);
    if (found.size < 1600) for (const m of text.matchAll(/["']([a-z][a-z0-9_.:-]{5,40})["']/g)) if (found.size < 1600) found.add(m[1]!);
  }
  const present = [...found];
  const inner = present.slice(0, 200).map((n) => n.slice(1, -1)).filter((n) => n.length >= 4);
  const absent = Array.from({ length: 2000 }, (_, i) => `plumbline_absent_event_${i}`);
  const all = [...present, ...inner, ...absent].slice(0, 2000);
  const mix = (k: number) => all.filter((_, i) => i % Math.round(2000 / k) === 0).slice(0, k);
  return { root, names: { 50: mix(50), 500: mix(500), 2000: all }, bytes };
}

/** The generated tree at `scale` times the base size (5,200 modules and 52 MB at scale 1). */
export function scanRepo(scale = 1): ScanRepo {
  const root = join(process.cwd(), '.bench', `${VERSION}-x${scale}`);
  const all = eventNames(2000);
  const names = { 50: all.slice(0, 50), 500: all.slice(0, 500), 2000: all };
  if (existsSync(join(root, '.done'))) return { root, names, bytes: Number(readFileSync(join(root, '.done'), 'utf8')) };
  rmSync(root, { recursive: true, force: true });
  mkdirSync(root, { recursive: true });
  const rand = random(42);
  let bytes = 0;
  for (let f = 0; f < FILES * scale; f++) {
    const dir = join(root, 'src', `pkg${f % 97}`, `mod${f % 13}`);
    mkdirSync(dir, { recursive: true });
    const lines: string[] = [`// generated module ${f}`, `import { track } from '../../track';`, ''];
    for (let fn = 0; fn < 40; fn++) {
      const w = WORDS[Math.floor(rand() * WORDS.length)]!;
      lines.push(`export function handle${w[0]!.toUpperCase()}${w.slice(1)}${f}_${fn}(input: { id: string; count: number }): number {`);
      lines.push(`  const ${w}Total = input.count * ${Math.floor(rand() * 1000)} + ${fn};`);
      lines.push(`  if (${w}Total > ${Math.floor(rand() * 5000)}) {`);
      const pick = Math.floor(rand() * 4000);
      // 60% of names are logged somewhere; every fifth of those only as a longer twin name.
      if (pick < all.length && pick % 10 < 6) lines.push(`    track('${all[pick]}${pick % 5 === 0 ? '_done' : ''}', { id: input.id });`);
      else lines.push(`    console.debug('no event for ${w} in module ${f}', input.id);`);
      lines.push(`  }`, `  return ${w}Total;`, `}`, '');
    }
    const text = lines.join('\n');
    bytes += Buffer.byteLength(text);
    writeFileSync(join(dir, `file${f}.ts`), text);
  }
  // Pad to 50 MB with larger vendored-looking files, still tracked and scanned.
  let pad = 0;
  while (bytes < scale * 52 * 1024 * 1024) {
    const text = Array.from({ length: 20000 }, (_, i) => `export const table_${pad}_${i} = ${Math.floor(rand() * 1e9)}; // ${WORDS[i % WORDS.length]} data row`).join('\n');
    mkdirSync(join(root, 'data'), { recursive: true });
    writeFileSync(join(root, 'data', `table${pad++}.ts`), text);
    bytes += Buffer.byteLength(text);
  }
  const git = (...args: string[]) => execFileSync('git', args, { cwd: root, stdio: 'pipe', env: { ...process.env, GIT_AUTHOR_NAME: 'b', GIT_AUTHOR_EMAIL: 'b@b.invalid', GIT_COMMITTER_NAME: 'b', GIT_COMMITTER_EMAIL: 'b@b.invalid' } });
  git('init', '-q', '-b', 'main');
  git('add', '-A');
  // No automatic gc in the background: it would hold the lock the packing below needs.
  git('-c', 'gc.auto=0', 'commit', '-q', '-m', 'generated');
  // Packed, as a clone or a CI checkout has it (loose objects would make every read a file open).
  git('gc', '-q');
  writeFileSync(join(root, '.done'), String(bytes));
  return { root, names, bytes };
}
