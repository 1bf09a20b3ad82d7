import type { ProgressReporter } from '../ports.js';

/** How the CLI writes: colour only on a terminal and never under NO_COLOR (https://no-color.org). */
export interface CliOutput {
  color: boolean;
  out(text: string): void;
  err(text: string): void;
  /** Draws progress on stderr when it is a terminal; a no-op otherwise, so logs and pipes stay clean. */
  progress: ProgressReporter;
}

export function createCliOutput(options: { noColorFlag: boolean }): CliOutput {
  const env = process.env;
  const color =
    !options.noColorFlag && !('NO_COLOR' in env && env.NO_COLOR !== '') && process.stdout.isTTY === true && env.TERM !== 'dumb';
  const interactive = process.stderr.isTTY === true && env.CI !== 'true';
  let drawn = false;
  return {
    color,
    out: (text) => process.stdout.write(text.endsWith('\n') ? text : `${text}\n`),
    err: (text) => process.stderr.write(text.endsWith('\n') ? text : `${text}\n`),
    progress(done, total, what) {
      // Short work finishes before a progress line would help.
      if (!interactive || total < 200) return;
      if (done < total) {
        if (done % 50 === 0) {
          process.stderr.write(`\rReading ${what}: ${done}/${total}`);
          drawn = true;
        }
      } else if (drawn) {
        process.stderr.write('\r\u001b[2K');
        drawn = false;
      }
    },
  };
}
