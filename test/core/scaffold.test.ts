import { describe, expect, it } from 'vitest';
import { loadPlan } from '../../src/core/plan/load.js';
import { renderPlanScaffold } from '../../src/core/plan/scaffold.js';
import { formatProblem } from '../../src/core/source/problem.js';

const draft = renderPlanScaffold({ flagKey: 'checkout-wallet-first', today: '2026-12-01', schemaPath: '../node_modules/plumbline/schema/plan.schema.json' });
const lines = draft.split('\n');

/** A commented line whose text is YAML (a key or a list item), not prose; the editor's modeline is neither. */
const COMMENTED_YAML = /^(\s*)# ((?:\s*- )?\s*[a-z][a-z0-9-]*:(?: |$).*)$/;
const isExample = (line: string) => COMMENTED_YAML.test(line) && !line.startsWith('# yaml-language-server:');

const indentOf = (line: string) => /^ */.exec(line.replace(COMMENTED_YAML, '$1$2'))![0].length;

/**
 * Each commented example, by line index: a commented key with the commented lines indented under it.
 * Two commented keys side by side (traffic-split, overlaps-with) are two examples.
 */
function exampleBlocks(): number[][] {
  const blocks: number[][] = [];
  lines.forEach((line, i) => {
    if (!isExample(line)) return;
    const last = blocks[blocks.length - 1];
    if (last && last[last.length - 1] === i - 1 && indentOf(line) > indentOf(lines[last[0]!]!)) last.push(i);
    else blocks.push([i]);
  });
  return blocks;
}

/** Uncommented as a person would: "# " removed, everything else as written. */
function uncomment(indexes: readonly number[]): string {
  const chosen = new Set(indexes);
  return lines.map((line, i) => (chosen.has(i) ? line.replace(COMMENTED_YAML, '$1$2') : line)).join('\n');
}

const errorsOf = (text: string) => {
  const result = loadPlan(text, 'experiments/checkout-wallet-first.yaml');
  return result.ok ? [] : result.errors.map(formatProblem);
};

describe('the draft of `plumbline new`', () => {
  const blocks = exampleBlocks();

  it('loads as written', () => expect(errorsOf(draft)).toEqual([]));

  it('has its commented examples, the guardrail and the decision rules among them', () => {
    expect(blocks.length).toBeGreaterThanOrEqual(7);
    const firsts = blocks.map((b) => lines[b[0]!]!.trim());
    expect(firsts).toContain('# guardrails:');
    expect(firsts).toContain('# decisions:');
  });

  it.each(exampleBlocks().map((b) => [lines[b[0]!]!.trim(), b] as const))('still loads with "%s" uncommented', (_, block) => {
    const text = uncomment(block);
    expect(text).not.toBe(draft);
    expect(errorsOf(text)).toEqual([]);
  });

  it('still loads with every example uncommented at once', () => {
    expect(errorsOf(uncomment(blocks.flat()))).toEqual([]);
  });

  it('points to references every user has: the schema command and Plumbline’s own documentation', () => {
    expect(draft).toContain('`plumbline schema plan`');
    expect(draft).toContain("plan reference in Plumbline's own documentation");
    expect(draft).not.toMatch(/Reference: docs\//);
  });
});
