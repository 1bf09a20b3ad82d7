import type { ProgressReporter } from '../ports.js';

/** How the CLI writes: colour only on a terminal and never under NO_COLOR (https://no-color.org). */
export interface CliOutput {
  color: boolean;
  out(text: string): void;
  err(text: string): void;
  /** Draws progress on stderr when it is a terminal; a no-op otherwise, so logs and pipes stay clean. */
  progress: ProgressReporter;
}

/** `write` replaces stdout and stderr (the fuzzer captures output this way); without it nothing is a terminal. */
export function createCliOutput(options: { noColorFlag: boolean; write?: { out(text: string): void; err(text: string): void } }): CliOutput {
  const env = process.env;
  const color =
    !options.write &&
    !options.noColorFlag && !('NO_COLOR' in env && env.NO_COLOR !== '') && process.stdout.isTTY === true && env.TERM !== 'dumb';
  const interactive = !options.write && process.stderr.isTTY === true && env.CI !== 'true';
  let drawn = false;
  return {
    color,
    out: (text) => (options.write ? options.write.out : (t: string) => process.stdout.write(t))(text.endsWith('\n') ? text : `${text}\n`),
    err: (text) => (options.write ? options.write.err : (t: string) => process.stderr.write(t))(text.endsWith('\n') ? text : `${text}\n`),
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
