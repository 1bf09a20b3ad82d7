import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

/** True when Rscript can be run here. */
export function hasR(): boolean {
  return spawnSync('Rscript', ['--version'], { encoding: 'utf8' }).status === 0;
}

/**
 * In CI, R is installed by .ci/run and the cross-checks must run: a missing R fails loudly there
 * instead of skipping. Elsewhere the checks skip with a message when R is absent.
 */
export function requireRInCi(): boolean {
  const available = hasR();
  if (!available && process.env.CI) {
    throw new Error('Rscript is not installed, but CI must cross-check the statistics against R: .ci/run installs r-base-core with apt-get');
  }
  return available;
}

/** Runs an R script with `input.csv` beside it and returns the rows of the `output.csv` it writes. */
export function runR(script: string, input: Record<string, number | string>[]): Record<string, number>[] {
  const dir = mkdtempSync(join(tmpdir(), 'plumbline-r-'));
  try {
    const columns = Object.keys(input[0] ?? {});
    const csv = [columns.join(','), ...input.map((row) => columns.map((c) => String(row[c])).join(','))].join('\n');
    writeFileSync(join(dir, 'input.csv'), `${csv}\n`);
    writeFileSync(join(dir, 'script.R'), script);
    const run = spawnSync('Rscript', ['--vanilla', 'script.R'], { cwd: dir, encoding: 'utf8' });
    if (run.status !== 0) throw new Error(`R failed: ${run.stderr}`);
    const [header, ...lines] = readFileSync(join(dir, 'output.csv'), 'utf8').trim().split('\n');
    const names = header!.split(',').map((n) => n.replace(/"/g, ''));
    return lines.map((line) => Object.fromEntries(line.split(',').map((v, i) => [names[i]!, Number(v.replace(/"/g, ''))])));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
