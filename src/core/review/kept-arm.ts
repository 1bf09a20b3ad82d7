import type { Plan } from '../plan/schema.js';
import { findCalls } from '../scan/calls.js';
import { resolveConstant } from '../scan/flag-touches.js';
import type { ChangedCode } from './context.js';

/**
 * Which arm a change keeps when it removes a test's flag read: the branch on the flag's value whose
 * code is still at head while the other branch's code is gone. A heuristic over text (a ternary or an
 * `if`/`else` on the value, read directly or through a variable, in brace languages), never a parser:
 * when the code does not show one arm plainly, the answer is "could not tell", with the reason.
 *
 * A boolean flag's true branch is the treatment (the flag turns the change on); a comparison with a
 * string names its arm (`variant === 'percent'`). Common practice, no source.
 */
export type KeptArm = { arm: string; where: { file: string; line: number } } | { unknown: string };

interface Branches {
  /** The code run when the condition holds, and otherwise ('' when an `if` has no `else`). */
  truthy: string;
  falsy: string;
  /** The arm the condition's truth stands for, and the arm for its falsity (undefined: not one arm). */
  truthyArm?: string;
  falsyArm?: string;
}

const IDENT = /[A-Za-z_$][\w$]*/y;

/** Offset just past the bracket that closes the one at `open`, skipping strings; -1 when unbalanced. */
function closing(text: string, open: number): number {
  const pairs: Record<string, string> = { '(': ')', '[': ']', '{': '}' };
  const stack: string[] = [];
  for (let i = open; i < text.length; i++) {
    const c = text[i]!;
    if (c === '"' || c === "'" || c === '`') {
      i = endOfString(text, i);
      continue;
    }
    if (pairs[c]) stack.push(pairs[c]);
    else if (c === ')' || c === ']' || c === '}') {
      if (stack.pop() !== c) return -1;
      if (stack.length === 0) return i + 1;
    }
  }
  return -1;
}

function endOfString(text: string, at: number): number {
  const quote = text[at]!;
  for (let i = at + 1; i < text.length; i++) {
    if (text[i] === '\\') i++;
    else if (text[i] === quote) return i;
    else if (text[i] === '\n' && quote !== '`') return i;
  }
  return text.length;
}

const skipSpace = (text: string, at: number) => {
  while (at < text.length && /\s/.test(text[at]!)) at++;
  return at;
};
const skipSpaceBack = (text: string, at: number) => {
  while (at > 0 && /\s/.test(text[at - 1]!)) at--;
  return at;
};

/** One expression operand from `at`: up to a `:`, `;` or `,` at depth 0, or a closer of an outer bracket. */
function operandEnd(text: string, at: number, stopAtColon: boolean): number {
  let nestedTernaries = 0;
  for (let i = at; i < text.length; i++) {
    const c = text[i]!;
    if (c === '"' || c === "'" || c === '`') i = endOfString(text, i);
    else if (c === '(' || c === '[' || c === '{') {
      const end = closing(text, i);
      if (end < 0) return text.length;
      i = end - 1;
    } else if (c === ')' || c === ']' || c === '}' || c === ';' || c === ',') return i;
    else if (c === '?' && text[i + 1] !== '.' && text[i + 1] !== '?' && text[i - 1] !== '?') nestedTernaries++;
    else if (c === ':' && stopAtColon) {
      if (nestedTernaries === 0) return i;
      nestedTernaries--;
    } else if (c === '\n' && !stopAtColon && /^\s*(?:\n|$)/.test(text.slice(i + 1, i + 2))) return i;
  }
  return text.length;
}

/** A statement or block from `at`: `{ … }`, or up to the `;` (or line end) that ends it. */
function statementEnd(text: string, at: number): number {
  if (text[at] === '{') return closing(text, at);
  const end = operandEnd(text, at, false);
  return text[end] === ';' ? end + 1 : end;
}

/** The branches of a conditional whose condition is the span [start, end) of the text, if it is one. */
function branchesAfter(text: string, start: number, end: number): { truthy: string; falsy: string; negated: boolean } | undefined {
  let negated = false;
  let from = skipSpaceBack(text, start);
  while (text[from - 1] === '!') {
    negated = !negated;
    from = skipSpaceBack(text, from - 1);
  }
  const after = skipSpace(text, end);
  // A ternary: `value ? a : b`.
  if (text[after] === '?' && text[after + 1] !== '.' && text[after + 1] !== '?') {
    const colon = operandEnd(text, after + 1, true);
    if (text[colon] !== ':') return undefined;
    const last = operandEnd(text, colon + 1, false);
    return { truthy: text.slice(after + 1, colon), falsy: text.slice(colon + 1, last), negated };
  }
  // An if statement: `if (value) …` or `if (!value) …`, the condition alone in its parentheses.
  if (text[after] !== ')' || text[from - 1] !== '(') return undefined;
  const keyword = skipSpaceBack(text, from - 1);
  if (!/(?:^|[^\w$])if$/.test(text.slice(Math.max(0, keyword - 3), keyword))) return undefined;
  const bodyAt = skipSpace(text, after + 1);
  const bodyEnd = statementEnd(text, bodyAt);
  if (bodyEnd < 0) return undefined;
  const elseAt = skipSpace(text, bodyEnd);
  let falsy = '';
  if (text.startsWith('else', elseAt) && !/[\w$]/.test(text[elseAt + 4] ?? '')) {
    const elseBody = skipSpace(text, elseAt + 4);
    const elseEnd = statementEnd(text, elseBody);
    if (elseEnd < 0) return undefined;
    falsy = text.slice(elseBody, elseEnd);
  }
  return { truthy: text.slice(bodyAt, bodyEnd), falsy, negated };
}

/** `value === 'arm'` (or `!==`, `==`, `!=`) right after the value: the arm named and whether it is negated. */
function comparedArm(text: string, end: number): { end: number; literal: string; negated: boolean } | undefined {
  const m = /^\s*(===|!==|==|!=)\s*(["'`])([^"'`\n]{1,100})\2/.exec(text.slice(end, end + 140));
  return m ? { end: end + m[0].length, literal: m[3]!, negated: m[1]!.startsWith('!') } : undefined;
}

/** The branches on one flag read: on the call itself, or on the variable it is assigned to. */
function branchesOfRead(text: string, callStart: number, callEnd: number, plan: Plan): Branches | { unknown: string } {
  const open = text.indexOf('(', callStart);
  const closed = open >= 0 && open < callEnd ? closing(text, open) : -1;
  if (closed < 0) return { unknown: 'the flag read’s call does not close' };
  // The expression starts at the receiver (`flags.getBooleanValue`) and may be awaited.
  let start = callStart;
  while (start > 0 && /[\w$.?]/.test(text[start - 1]!)) start--;
  const beforeAwait = skipSpaceBack(text, start);
  if (text.slice(beforeAwait - 5, beforeAwait) === 'await') start = beforeAwait - 5;
  const arms = armsOf(plan);
  // A negated condition runs its first branch when the value is false: the arms trade places, the code does not.
  const toBranches = (b: NonNullable<ReturnType<typeof branchesAfter>>, whenTrue: string | undefined, whenFalse: string | undefined): Branches => {
    const [truthyArm, falsyArm] = b.negated ? [whenFalse, whenTrue] : [whenTrue, whenFalse];
    return { truthy: b.truthy, falsy: b.falsy, ...(truthyArm ? { truthyArm } : {}), ...(falsyArm ? { falsyArm } : {}) };
  };
  const onValue = (valueStart: number, valueEnd: number): Branches | undefined => {
    const compared = comparedArm(text, valueEnd);
    if (compared) {
      const b = branchesAfter(text, valueStart, compared.end);
      if (!b || !plan.design.arms.some((a) => a.name === compared.literal)) return undefined;
      const other = plan.design.arms.length === 2 ? plan.design.arms.find((a) => a.name !== compared.literal)!.name : undefined;
      return compared.negated ? toBranches(b, other, compared.literal) : toBranches(b, compared.literal, other);
    }
    const b = branchesAfter(text, valueStart, valueEnd);
    return b && toBranches(b, arms?.treatment, arms?.control);
  };
  const direct = onValue(start, closed);
  if (direct) return direct;
  // `const wallet = flags.getBooleanValue(…)`: the branch is on the variable, further down.
  const assigned = /(?:^|[\s;{(,])(?:(?:const|let|var|val|final|auto)\s+)?([A-Za-z_$][\w$]*)\s*(?::\s*[\w$<>[\]| ]+)?=\s*$/.exec(text.slice(Math.max(0, start - 200), start));
  if (!assigned) return { unknown: 'the flag’s value is neither branched on nor assigned to a variable' };
  const name = assigned[1]!;
  for (let at = text.indexOf(name, closed); at >= 0; at = text.indexOf(name, at + name.length)) {
    IDENT.lastIndex = at;
    const whole = IDENT.exec(text)?.[0] === name && !/[\w$.]/.test(text[at - 1] ?? '');
    if (!whole) continue;
    const found = onValue(at, at + name.length);
    if (found) return found;
  }
  return { unknown: `no ternary or if/else on \`${name}\`` };
}

/** The plan's treatment and control when there is exactly one treatment (a boolean flag's two values). */
function armsOf(plan: Plan): { treatment: string; control: string } | undefined {
  const treatments = plan.design.arms.filter((a) => a.name !== plan.design.control);
  return treatments.length === 1 ? { treatment: treatments[0]!.name, control: plan.design.control } : undefined;
}

/** The statements of a branch, each without white space, skipping bare braces and short tokens. */
function statementsOf(code: string): string[] {
  return code
    .split(/[;\n]/)
    .map((s) => s.replace(/\s+/g, '').replace(/^[{}]+|[{}]+$/g, ''))
    .filter((s) => s.length >= 4);
}

/** Whether every statement, none, or some of a branch is still in the head's text. */
function presence(code: string, head: string): 'all' | 'none' | 'some' | 'empty' {
  const statements = statementsOf(code);
  if (statements.length === 0) return 'empty';
  const found = statements.filter((s) => head.includes(s)).length;
  return found === statements.length ? 'all' : found === 0 ? 'none' : 'some';
}

function keptInOneFile(b: Branches, headText: string): { arm: string } | { unknown: string } {
  const head = headText.replace(/\s+/g, '');
  const t = presence(b.truthy, head);
  const f = presence(b.falsy, head);
  if (statementsOf(b.truthy).join() === statementsOf(b.falsy).join()) return { unknown: 'both branches hold the same code' };
  let kept: 'truthy' | 'falsy' | undefined;
  if (t === 'all' && (f === 'none' || f === 'empty')) kept = 'truthy';
  else if (f === 'all' && (t === 'none' || t === 'empty')) kept = 'falsy';
  // An `if` without `else`: its body gone means the code runs as it did for the other arm.
  else if (t === 'none' && f === 'empty') kept = 'falsy';
  if (!kept) return { unknown: 'the code of both branches, or parts of each, is still there' };
  const arm = kept === 'truthy' ? b.truthyArm : b.falsyArm;
  return arm ? { arm } : { unknown: 'the branch kept does not name one arm of the plan' };
}

/**
 * The arm a change keeps for `plan`, from the flag reads it removes (`reads`: file at base and line).
 * Every read must agree; one that cannot be read, or two that disagree, gives "could not tell".
 */
export function keptArm(plan: Plan, reads: readonly { file: string; line: number }[], code: readonly ChangedCode[], flagPatterns: readonly RegExp[]): KeptArm {
  const keys = new Set(plan.flags);
  const answers: ({ arm: string; file: string; line: number } | { unknown: string })[] = [];
  for (const read of reads) {
    const changed = code.find((c) => c.basePath === read.file);
    if (!changed?.base) {
      answers.push({ unknown: `${read.file} could not be read at the base commit` });
      continue;
    }
    const base = changed.base;
    const call = findCalls(base, read.file, flagPatterns).find((s) => s.line <= read.line && read.line <= s.endLine && keys.has(s.groups.key ?? resolveConstant(base, s.groups.ident ?? '') ?? ''));
    if (!call) {
      answers.push({ unknown: `no flag call at ${read.file}:${read.line}` });
      continue;
    }
    const branches = branchesOfRead(base, call.start, call.end, plan);
    if ('unknown' in branches) {
      answers.push({ unknown: `${read.file}:${read.line}: ${branches.unknown}` });
      continue;
    }
    // A file the change deletes keeps nothing of either branch.
    const kept = changed.head !== undefined ? keptInOneFile(branches, changed.head) : { unknown: `${read.file} is deleted` };
    answers.push('arm' in kept ? { arm: kept.arm, file: read.file, line: read.line } : { unknown: `${read.file}:${read.line}: ${kept.unknown}` });
  }
  const unknown = answers.find((a): a is { unknown: string } => 'unknown' in a);
  if (unknown) return unknown;
  const arms = [...new Set(answers.map((a) => ('arm' in a ? a.arm : '')))];
  if (arms.length !== 1) return { unknown: arms.length === 0 ? 'no flag read to read it from' : `the reads keep different arms (${arms.join(', ')})` };
  const first = answers[0] as { arm: string; file: string; line: number };
  return { arm: first.arm, where: { file: first.file, line: first.line } };
}
