import picomatch from 'picomatch';
import type { RegistryEntry } from '../registry/schema.js';
import type { ChangedCode, Check } from '../review/context.js';
import type { Finding } from '../review/finding.js';
import { lineIndex, lineStarts, type CallSite } from '../scan/calls.js';
import { blocksOf, enclosing, enclosingFunction } from '../scan/code-blocks.js';
import { commentsOfText, insideRanges } from '../scan/comments.js';
import { evidenceKindOf } from '../scan/evidence.js';
import { DEFAULT_FLAG_FILES } from '../scan/flag-files.js';
import { flagReadsOf } from '../scan/flag-touches.js';
import { flagPatternsOf } from '../scan/patterns.js';
import { hasOutcome, hasStarted, ownersOf } from './test-lifecycle.js';

type Raw = Omit<Finding, 'severity'>;

/** Lines [from, to] around a flag read that make up the treatment: its function, else its block, else ± `spread` lines. */
function treatmentLines(text: string, path: string, read: CallSite, spread: number): { from: number; to: number } {
  const blocks = blocksOf(text, path);
  const holder = enclosingFunction(blocks, read.start) ?? enclosing(blocks, read.start).at(-1);
  if (!holder) return { from: read.line - spread, to: read.endLine + spread };
  const lineOf = lineIndex(text);
  return { from: lineOf(holder.headerStart), to: lineOf(holder.close) };
}

/** Changed lines that carry code: not blank, not only a comment. */
function codeLines(text: string, path: string, lines: readonly number[]): Set<number> {
  const comments = commentsOfText(text, path);
  const all = text.split('\n');
  const starts = lineStarts(text);
  return new Set(
    lines.filter((n) => {
      const line = all[n - 1] ?? '';
      const first = line.search(/\S/);
      return first !== -1 && !insideRanges(comments, starts[n - 1]! + first);
    }),
  );
}

/** The first changed code line near a read of one of `keys` on one side of a file, other than the read itself. */
function changeNearRead(text: string | undefined, path: string, lines: readonly number[], keys: ReadonlySet<string>, patterns: RegExp[], spread: number): number | undefined {
  if (text === undefined || lines.length === 0) return undefined;
  const reads = flagReadsOf(text, path, patterns, keys);
  if (reads.length === 0) return undefined;
  const changed = codeLines(text, path, lines);
  for (const read of reads) {
    const { from, to } = treatmentLines(text, path, read, spread);
    const hit = [...changed].sort((a, b) => a - b).find((n) => n >= from && n <= to && (n < read.line || n > read.endLine));
    if (hit !== undefined) return hit;
  }
  return undefined;
}

function codeChange(entry: RegistryEntry, file: ChangedCode, patterns: RegExp[], spread: number): Raw | undefined {
  const keys = new Set(entry.flags);
  const atHead = changeNearRead(file.head, file.path, file.added, keys, patterns, spread);
  const atBase = atHead === undefined ? changeNearRead(file.base, file.basePath, file.removed, keys, patterns, spread) : undefined;
  if (atHead === undefined && atBase === undefined) return undefined;
  return {
    code: 'treatment-changed',
    message: `This change edits the code around the read of ${entry.flags.map((k) => `\`${k}\``).join(', ')} (${atHead !== undefined ? `line ${atHead}` : `line ${atBase} at the base commit`}), which the started test ${entry.id} (${ownersOf(entry)}) randomizes: people assigned before and after the change have had different treatments.`,
    fix: `Ask ${ownersOf(entry)}: restart ${entry.id}, or record the change date under amendments: in its plan so the analysis can be split there.`,
    plan: entry.id,
    file: atHead !== undefined ? file.path : file.basePath,
    line: atHead ?? atBase!,
    ...(atHead === undefined ? { side: 'base' as const } : {}),
  };
}

/**
 * A started test compares treatments as they were when it started. Code changed next to its flag read
 * (in the same function, block or a few lines) changes a treatment mid-test, and a changed definition
 * of its flag (arms, weights, rollout) pools data from before and after a ramp, which biases the result.
 */
export const treatmentChanged: Check = (context) => {
  const patterns = flagPatternsOf(context.settings);
  const isFlagFile = picomatch(DEFAULT_FLAG_FILES, { dot: true });
  const started = new Map<string, RegistryEntry>();
  // A test whose outcome the change records is over: editing the code around its flag is acting on the result.
  const ended = new Set(context.registry.entries.filter(hasOutcome).map((e) => e.id));
  for (const e of context.baseEntries) if (hasStarted(e, context.today) && !ended.has(e.id)) started.set(e.id, e);
  const findings: Raw[] = [];
  for (const entry of started.values()) {
    for (const file of context.changedCode) {
      if (isFlagFile(file.path) || evidenceKindOf(file.path) !== 'code') continue;
      const found = codeChange(entry, file, patterns, context.settings.treatmentLines);
      if (found) {
        findings.push(found);
        break;
      }
    }
    const ramp = context.touches.find((t) => t.via === 'definition' && entry.flags.includes(t.key));
    if (ramp) {
      findings.push({
        code: 'treatment-changed',
        message: `This change edits the definition of \`${ramp.key}\` in ${ramp.file} (arms, weights, rollout or targeting), which the started test ${entry.id} (${ownersOf(entry)}) randomizes; pooling data from before and after a ramp biases the result.`,
        fix: `Ask ${ownersOf(entry)}: keep the allocation until the planned end, or restart ${entry.id} (or record the change date under amendments: and analyse the periods apart).`,
        plan: entry.id,
        file: ramp.file,
        line: ramp.line,
        ...(ramp.side === 'removed' ? { side: 'base' as const } : {}),
      });
    }
  }
  return findings;
};
