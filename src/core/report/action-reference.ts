import { parse } from 'yaml';

/** The README's inputs and outputs tables, from action.yml (the single source). */
export function renderActionReference(actionYaml: string): string {
  const action = parse(actionYaml) as { inputs?: Record<string, { description?: string; default?: string; required?: boolean }>; outputs?: Record<string, { description?: string }> };
  const cell = (text: string | undefined) => (text ?? '').replace(/\|/g, '\\|').replace(/\n/g, ' ');
  return [
    '| input | default | meaning |',
    '| --- | --- | --- |',
    ...Object.entries(action.inputs ?? {}).map(([name, spec]) => `| \`${name}\` | ${spec.default ? `\`${cell(spec.default)}\`` : ''} | ${cell(spec.description)} |`),
    '',
    '| output | meaning |',
    '| --- | --- |',
    ...Object.entries(action.outputs ?? {}).map(([name, spec]) => `| \`${name}\` | ${cell(spec.description)} |`),
  ].join('\n');
}

export const ACTION_REFERENCE_START = '<!-- action-reference:start (generated from action.yml by npm run schema) -->';
export const ACTION_REFERENCE_END = '<!-- action-reference:end -->';

/** The README with its generated block replaced by the current tables. */
export function withActionReference(readme: string, actionYaml: string): string {
  const start = readme.indexOf(ACTION_REFERENCE_START);
  const end = readme.indexOf(ACTION_REFERENCE_END);
  if (start < 0 || end < start) return readme;
  return `${readme.slice(0, start + ACTION_REFERENCE_START.length)}\n${renderActionReference(actionYaml)}\n${readme.slice(end)}`;
}
