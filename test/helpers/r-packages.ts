import { spawnSync } from 'node:child_process';
import { hasR } from './r.js';

/**
 * True when R and the named R package can be loaded. In CI the package is installed by .ci/run
 * (Debian's r-cran-<name>), so a missing one fails the run loudly instead of skipping the checks.
 */
export function requireRPackageInCi(name: string): boolean {
  const available = hasR() && spawnSync('Rscript', ['--vanilla', '-e', `library(${name})`], { encoding: 'utf8' }).status === 0;
  if (!available && process.env.CI) {
    throw new Error(`the R package ${name} is not installed, but CI must cross-check against it: .ci/run installs r-cran-${name} with apt-get`);
  }
  return available;
}

/** The tail of an R script that writes the data frame `out` with every digit. */
export const WRITE_OUTPUT = `
out[] <- lapply(out, function(x) sprintf("%.17g", x))
write.csv(out, "output.csv", row.names = FALSE, quote = FALSE)
`;

export const relativeError = (ours: number, theirs: number) => Math.abs(ours - theirs) / Math.max(Math.abs(theirs), 1e-300);
