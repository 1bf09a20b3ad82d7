import type { CallSite } from './calls.js';
import { lineIndex } from './calls.js';
import { blocksOf, enclosing, enclosingFunction, isControlHeader, type Block } from './code-blocks.js';

/** An exposure logging call that only some arms reach, with the lines that show why. */
export interface OneArmExposure {
  kind: 'branch' | 'early-return';
  /** The exposure call, the flag read and the branch or return between them: line and trimmed text. */
  exposure: { line: number; text: string };
  flag: { line: number; text: string };
  condition: { line: number; text: string };
}

/**
 * Where the expression of a flag read starts: back over its receiver chain, which a formatter may split
 * over lines (`client\n  .getBooleanValue(`, Go's `client.\n\tBooleanValue(`).
 */
function receiverStart(text: string, read: CallSite): number {
  const space = (at: number) => {
    while (at > 0 && /\s/.test(text.charAt(at - 1))) at--;
    return at;
  };
  let start = read.start;
  for (;;) {
    let at = space(start);
    if (text.charAt(at - 1) !== '.') return start;
    at = space(at - (text.charAt(at - 2) === '?' ? 2 : 1));
    let name = at;
    while (name > 0 && /[\w$]/.test(text.charAt(name - 1))) name--;
    if (name === at) return start;
    start = name;
  }
}

/**
 * The variable a flag read is stored in, when the read is assigned: `const on = client.getBooleanValue(…)`,
 * Go's `on, err := client.BooleanValue(…)` (the first of several results).
 */
function assignedName(text: string, read: CallSite): string | undefined {
  const start = receiverStart(text, read);
  const before = text.slice(text.lastIndexOf('\n', start - 1) + 1, start);
  return /(?:^|[^\w$.])([A-Za-z_$][\w$]*)(?:\s*,\s*[A-Za-z_$][\w$]*)*\s*(?::\s*[^=]+)?\s*:?=\s*(?:await\s+)?$/.exec(before)?.[1];
}

/** The conditions that decide a block: its own, and for an `else` those of the `if` chain before it. */
function conditionsOf(text: string, blocks: readonly Block[], block: Block): Block[] {
  const chain = [block];
  let current = block;
  while (/^else\b/.test(current.header)) {
    const previous = blocks.filter((b) => b.close < current.open && /^[\s}]*$/.test(text.slice(b.close + 1, current.open).replace(/\belse\b/, ''))).at(-1);
    if (!previous) break;
    chain.push(previous);
    current = previous;
  }
  return chain;
}

/**
 * Exposure calls that sit inside a branch on a flag's value, or after an early return that depends on it,
 * in the same function as the flag read. Such a call logs exposure in some arms only (often not in
 * control), so the arms are compared over different people: a classic cause of sample ratio mismatch.
 */
export function exposureInOneArm(text: string, path: string, reads: readonly CallSite[], exposures: readonly CallSite[]): OneArmExposure[] {
  if (reads.length === 0 || exposures.length === 0) return [];
  const blocks = blocksOf(text, path);
  const lineOf = lineIndex(text);
  const lineText = (offset: number) => {
    const start = text.lastIndexOf('\n', offset - 1) + 1;
    const end = text.indexOf('\n', offset);
    return text.slice(start, end === -1 ? text.length : end).trim();
  };
  const at = (offset: number) => ({ line: lineOf(offset), text: lineText(offset) });
  // A header a formatter split over lines is quoted from its first line, where its keyword is.
  const headerAt = (b: Block) => b.headerStart + Math.max(0, text.slice(b.headerStart, b.open).search(/\S/));
  const found: OneArmExposure[] = [];
  for (const log of exposures) {
    const fn = enclosingFunction(blocks, log.start);
    const read = reads.filter((r) => r.start < log.start && enclosingFunction(blocks, r.start) === fn).at(-1);
    if (!read) continue;
    const name = assignedName(text, read);
    const named = name !== undefined ? new RegExp(`(?<![\\w$.])${name.replace(/\$/g, '\\$')}(?![\\w$])`) : undefined;
    const mentions = (b: Block) => (read.start >= b.headerStart && read.start < b.open) || (named?.test(b.header) ?? false);
    // Inside a branch on the flag (or on the variable that holds it).
    const inner = enclosing(blocks, log.start).filter((b) => (!fn || b.open > fn.open) && isControlHeader(b.header));
    const branch = inner.map((b) => conditionsOf(text, blocks, b).find(mentions)).find((b) => b !== undefined);
    if (branch) {
      found.push({ kind: 'branch', exposure: at(log.start), flag: at(read.start), condition: at(headerAt(branch)) });
      continue;
    }
    // After an early return that depends on it: `if (variant === 'off') return [];` (Go: `if v == "off" {`) between the read and the call.
    const between = text.slice(read.end, log.start);
    const condition = name ?? '';
    const oneLine = new RegExp(`\\bif\\b[^\\n]*(?<![\\w$.])${condition.replace(/\$/g, '\\$')}(?![\\w$])[^\\n]*?(?:\\)|:|(?=\\s*\\{))\\s*(?:\\{\\s*)?(?:\\n\\s*)?(?:return|throw|raise)\\b`);
    const early = name ? oneLine.exec(between) : null;
    if (early) found.push({ kind: 'early-return', exposure: at(log.start), flag: at(read.start), condition: at(read.end + early.index) });
  }
  return found;
}
