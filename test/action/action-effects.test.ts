import { describe, expect, it } from 'vitest';
import { CART_CODE_TOUCHED, cleanPlan, planYaml } from '../review/scenarios.js';
import { runAction } from './run-action.js';
import { actionScenarios } from './scenarios.js';

/** What the bundled Action writes besides the comment: annotations, log lines, outputs; and how it lives with GitHub's listing lag. */
const { setup } = actionScenarios();

/**
 * The workflow commands in a step's stdout, parsed as the runner does (GitHub's "Workflow commands
 * for GitHub Actions": `::name key=value,key=value::message`, with %25, %0D, %0A in messages and also
 * %3A, %2C in property values).
 */
function workflowCommands(stdout: string) {
  const unescape = (text: string) => text.replace(/%0D/g, '\r').replace(/%0A/g, '\n').replace(/%3A/g, ':').replace(/%2C/g, ',').replace(/%25/g, '%');
  return stdout
    .split('\n')
    .filter((line) => line.startsWith('::'))
    .map((line) => {
      const m = /^::([a-z-]+)(?: ([^:]*))?::(.*)$/.exec(line);
      if (!m) return { name: '(unparsable)', properties: {} as Record<string, string>, message: line };
      const properties = Object.fromEntries((m[2] ?? '').split(',').filter(Boolean).map((kv) => [kv.slice(0, kv.indexOf('=')), unescape(kv.slice(kv.indexOf('=') + 1))]));
      return { name: m[1]!, properties, message: unescape(m[3]!) };
    });
}

const count = (commands: ReturnType<typeof workflowCommands>, name: string) => commands.filter((c) => c.name === name).length;

describe('annotations', () => {
  it('keeps every kind within GitHub’s 10 per step, the closing error line included', async () => {
    // Twelve plans without decision rules: twelve blocking findings, each at its plan file.
    const plans = Object.fromEntries(
      Array.from({ length: 12 }, (_, i) => [`experiments/p${i}.yaml`, planYaml(cleanPlan({ id: `p${i}`, flags: [`p${i}-flag`], surface: { path: `shop/p${i}` }, decisions: { win: 'Ship.' } }))]),
    );
    const { repo, github, event } = await setup(plans);
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status).toBe(1);
    expect(Number(run.outputs.blocking)).toBeGreaterThanOrEqual(12);
    const commands = workflowCommands(run.stdout);
    for (const kind of ['error', 'warning', 'notice']) expect(count(commands, kind), kind).toBeLessThanOrEqual(10);
    const errors = commands.filter((c) => c.name === 'error');
    expect(errors.at(-1)!.message).toMatch(/^Plumbline: \d+ blocking findings; see the summary/);
    expect(commands.some((c) => c.name === 'notice' && /^\d+ more findings? (is|are) not annotated/.test(c.message))).toBe(true);
  });
});

describe('untrusted names in the log', () => {
  it('cannot start a workflow command from a file name or a flag key, and reach the annotation unchanged', async () => {
    const key = 'x%0A::set-output::clear%0D%0A::error::injected-by-key';
    const path = 'src/odd\n::error::injected,line=1\n.ts';
    const { repo, github, event } = await setup({ [path]: `client.getBooleanValue('${key}', false);\n` });
    const run = await runAction({ github, workspace: repo.root, event });
    const commands = workflowCommands(run.stdout);
    expect(commands.map((c) => c.name).filter((n) => !['error', 'warning', 'notice', 'debug'].includes(n))).toEqual([]);
    expect(run.stdout).not.toMatch(/^::set-output/m);
    expect(run.stdout).not.toMatch(/^::error::injected/m);
    expect(run.outputs.verdict).toBe('warnings');
    const annotation = commands.find((c) => c.name === 'warning' && c.properties.file === path);
    expect(annotation, run.stdout).toBeDefined();
    expect(annotation!.message).toContain(key);
  });
});

describe('listing lag', () => {
  const MARKER = '<!-- plumbline:review -->';

  it('keeps a comment that the next listing does not show yet, and the next run finds it', async () => {
    const { repo, github, event } = await setup({ 'src/cart.ts': CART_CODE_TOUCHED }, { listingLag: 1 });
    const first = await runAction({ github, workspace: repo.root, event });
    expect(first.status, first.stdout).toBe(0);
    expect(first.stdout).not.toContain('internal error');
    expect(github.comments(7)).toHaveLength(1);
    github.modes.listingLag = 0;
    const second = await runAction({ github, workspace: repo.root, event });
    expect(second.status).toBe(0);
    expect(github.comments(7)).toHaveLength(1);
    expect(github.comments(7)[0]!.body.startsWith(MARKER)).toBe(true);
    expect(github.refused).toEqual([]);
  });

  it('keeps a digest issue that the next listing does not show yet', async () => {
    const { repo, github } = await setup({}, { listingLag: 1 });
    const run = await runAction({ github, workspace: repo.root, event: { schedule: '0 7 * * 1' }, eventName: 'schedule' });
    expect(run.status, run.stdout).toBe(0);
    expect(run.stdout).not.toContain('internal error');
    expect(github.issues()).toHaveLength(1);
    expect(github.refused).toEqual([]);
  });
});
