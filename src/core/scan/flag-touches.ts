import type { FileDiff } from './diff.js';
import { findCalls, lineStarts, type CallSite } from './calls.js';
import { commentsOfText, insideRanges } from './comments.js';
import { QUOTED_STRING, constantValue } from './patterns.js';

/** A changed line that evaluates, defines or names a feature flag. */
export interface FlagTouch {
  key: string;
  file: string;
  line: number;
  /** Whether the line was added (head side) or removed (base side). */
  side: 'added' | 'removed';
  /** How the key was found: an evaluation call with a literal or a constant, a known key in a string, or a flag definition file. */
  via: 'call' | 'constant' | 'literal' | 'definition';
}

export interface FlagTouchInputs {
  diffs: readonly FileDiff[];
  /** Compiled flag-call patterns (with the g flag). */
  patterns: readonly RegExp[];
  /** Keys Plumbline already knows (plans, exemptions, flag files): a string equal to one counts as touching it. */
  knownKeys: ReadonlySet<string>;
  /** Text of a changed file on either side, to resolve constants; undefined when unknown. */
  textOf(side: 'added' | 'removed', path: string): string | undefined;
}

/** Finds every flag key a change touches in code. Flag definition files are handled by flagDefinitionTouches. */
export function findFlagTouches(inputs: FlagTouchInputs): FlagTouch[] {
  const touches: FlagTouch[] = [];
  const seen = new Set<string>();
  const add = (touch: FlagTouch) => {
    const id = `${touch.key}\0${touch.file}\0${touch.line}\0${touch.side}`;
    if (!seen.has(id)) {
      seen.add(id);
      touches.push(touch);
    }
  };
  for (const diff of inputs.diffs) {
    if (diff.binary) continue;
    for (const side of ['added', 'removed'] as const) {
      const file = side === 'removed' ? (diff.previousPath ?? diff.path) : diff.path;
      const text = inputs.textOf(side, file);
      const changed = new Set(diff[side].map((l) => l.line));
      if (text !== undefined) {
        // Over the whole file, so a call a formatter split over lines counts when any of its lines changed.
        for (const site of findCalls(text, file, inputs.patterns)) {
          let touched = false;
          for (let line = site.line; line <= site.endLine && !touched; line++) touched = changed.has(line);
          if (!touched) continue;
          const key = flagKeyOf(text, site);
          if (key) add({ key, file, line: site.valueLine, side, via: site.groups.key ? 'call' : 'constant' });
        }
      } else {
        for (const { line, text: lineText } of diff[side]) {
          for (const pattern of inputs.patterns) {
            pattern.lastIndex = 0;
            for (const match of lineText.matchAll(pattern)) if (match.groups?.key) add({ key: match.groups.key, file, line, side, via: 'call' });
          }
        }
      }
      const comments = text !== undefined ? commentsOfText(text, file) : [];
      const lineStart = text !== undefined ? lineStarts(text) : [];
      for (const { line, text: lineText } of diff[side]) {
        for (const match of lineText.matchAll(QUOTED_STRING)) {
          if (!inputs.knownKeys.has(match[2]!)) continue;
          if (text !== undefined && insideRanges(comments, (lineStart[line - 1] ?? 0) + match.index)) continue;
          add({ key: match[2]!, file, line, side, via: 'literal' });
        }
      }
    }
  }
  return touches;
}

/** The flag key a call reads: its literal key, or the string its constant holds where the same text defines it. */
export function flagKeyOf(text: string, site: CallSite): string | undefined {
  return site.groups.key ?? (site.groups.ident ? resolveConstant(text, site.groups.ident) : undefined);
}

/** The calls in a text that read one of `keys`, by a literal key or a constant that holds it, split calls included. */
export function flagReadsOf(text: string, path: string, patterns: readonly RegExp[], keys: ReadonlySet<string>): CallSite[] {
  return findCalls(text, path, patterns).filter((site) => {
    const key = flagKeyOf(text, site);
    return key !== undefined && keys.has(key);
  });
}

/** The string a constant holds, looked up where it is defined in the same file (last segment of a dotted name). */
export function resolveConstant(text: string | undefined, ident: string): string | undefined {
  if (!text) return undefined;
  const name = ident.slice(ident.lastIndexOf('.') + 1);
  return constantValue(text, name);
}
