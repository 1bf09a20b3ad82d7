/**
 * What counts as a broken promise in one command's output. A failure has a kind and a signature (the
 * kind plus the shape of the detail, numbers and names blanked) so that a long run groups what it finds.
 */
export interface Failure {
  kind: 'internal-error' | 'bad-exit' | 'non-number' | 'null-number' | 'unlocated-problem' | 'too-slow' | 'bad-json';
  detail: string;
}

/** Words a report prints when a number went wrong. */
const NON_NUMBER = /(?<![\w.-])(NaN|-?Infinity|∞|n\/a)(?![\w-])/;

/** Problems about the file as a whole (it cannot be read as YAML at all) have no field to name. */
const WHOLE_FILE_CODES = /\/(bad-yaml|too-deep|too-large|several-documents|duplicate-key|complex-key|too-many-aliases|unreadable|not-a-mapping|empty)$/;

/** Keys whose value is a number in every report format; null there means a NaN or Infinity was serialized. */
function nullNumbers(value: unknown): string[] {
  const found: string[] = [];
  const stack: { at: string; value: unknown }[] = [{ at: '', value }];
  while (stack.length) {
    const { at, value: v } = stack.pop()!;
    if (v === null) found.push(at);
    else if (Array.isArray(v)) v.forEach((child, i) => stack.push({ at: `${at}[${i}]`, value: child }));
    else if (typeof v === 'object') for (const [k, child] of Object.entries(v as object)) stack.push({ at: at ? `${at}.${k}` : k, value: child });
  }
  return found;
}

interface ProblemLike {
  code?: unknown;
  file?: unknown;
  line?: unknown;
  field?: unknown;
  message?: unknown;
  expected?: unknown;
}

function problemsIn(value: unknown): ProblemLike[] {
  const found: ProblemLike[] = [];
  const stack: unknown[] = [value];
  while (stack.length) {
    const v = stack.pop();
    if (Array.isArray(v)) stack.push(...v);
    else if (v !== null && typeof v === 'object') {
      const record = v as Record<string, unknown>;
      if (typeof record.code === 'string' && typeof record.message === 'string' && 'severity' in record && 'line' in record) found.push(record);
      else stack.push(...Object.values(record));
    }
  }
  return found;
}

export function checkOutput(options: { command: string; format: string; exit: number; stdout: string; stderr: string; ms: number; timeLimitMs: number; inputText: string }): Failure[] {
  const failures: Failure[] = [];
  const { command, stdout, stderr } = options;
  if (options.exit === 3 || /internal error/.test(stderr)) failures.push({ kind: 'internal-error', detail: `${command}: ${stderr.split('\n').slice(0, 2).join(' | ').slice(0, 300)}` });
  else if (![0, 1, 2].includes(options.exit)) failures.push({ kind: 'bad-exit', detail: `${command}: exit ${options.exit}` });
  if (options.ms > options.timeLimitMs) failures.push({ kind: 'too-slow', detail: `${command}: ${Math.round(options.ms)} ms` });
  // A word the input itself contains may be echoed back (a title that says "n/a"); only new ones count.
  const printed = `${stdout}\n${stderr}`;
  const word = NON_NUMBER.exec(printed)?.[1];
  if (word && !options.inputText.includes(word)) {
    const line = printed.split('\n').find((l) => l.includes(word)) ?? '';
    failures.push({ kind: 'non-number', detail: `${command} ${options.format}: ${line.trim().slice(0, 200)}` });
  }
  if (options.format === 'json' && stdout.trim()) {
    let parsed: unknown;
    try {
      parsed = JSON.parse(stdout);
    } catch (error) {
      failures.push({ kind: 'bad-json', detail: `${command}: ${(error as Error).message}` });
      return failures;
    }
    for (const at of nullNumbers(parsed)) failures.push({ kind: 'null-number', detail: `${command}: null at ${at}` });
    // Problems (codes such as plan/bad-type) name a field; review findings name a file and line only.
    for (const problem of problemsIn(parsed).filter((p) => String(p.code).includes('/'))) {
      const located = typeof problem.file === 'string' && problem.file !== '' && typeof problem.line === 'number' && problem.line >= 1;
      // An empty field is the document itself (a file that is a number, not a mapping): fine when it says what was expected.
      const fielded = typeof problem.field === 'string' && (problem.field !== '' || WHOLE_FILE_CODES.test(String(problem.code)) || typeof problem.expected === 'string');
      if (!located || !fielded) failures.push({ kind: 'unlocated-problem', detail: `${command}: ${String(problem.code)} file=${String(problem.file)} line=${String(problem.line)} field=${JSON.stringify(problem.field)}: ${String(problem.message).slice(0, 120)}` });
    }
  }
  return failures;
}

/** The failure with its variable parts blanked, to group a long run's findings. */
export function signatureOf(failure: Failure): string {
  const detail = failure.kind === 'unlocated-problem' ? failure.detail.replace(/: .*$/s, '') : failure.detail;
  return `${failure.kind}: ${detail.replace(/\d+(\.\d+)?(e[+-]?\d+)?/g, '#').replace(/"[^"]*"/g, '"…"').replace(/\[#\]/g, '[]').slice(0, 160)}`;
}
