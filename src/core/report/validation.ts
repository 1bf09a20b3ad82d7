import { formatProblem, type Problem } from '../source/problem.js';
import { terminalSafe, terminalStyle } from './terminal-style.js';

/** What `validate` found: the value behind the terminal text and the JSON. */
export interface ValidationReport {
  settingsFile?: string;
  planFiles: number;
  validPlans: number;
  registryFiles: number;
  registryEntries: number;
  errors: number;
  warnings: number;
  problems: Problem[];
}

export const VALIDATION_JSON_FORMAT = 'plumbline.validation/1';

export function validationJson(report: ValidationReport): object {
  return { format: VALIDATION_JSON_FORMAT, valid: report.errors === 0, ...report };
}

export function renderValidationText(report: ValidationReport, options: { color: boolean }): string {
  const style = terminalStyle(options.color);
  const lines = report.problems.map((problem) => {
    const line = terminalSafe(formatProblem(problem));
    return problem.severity === 'error' ? line.replace(': error: ', `: ${style.red('error')}: `) : line.replace(': warning: ', `: ${style.yellow('warning')}: `);
  });
  const invalid = report.planFiles - report.validPlans;
  const files = `${count(report.planFiles, 'plan file')}${report.registryFiles ? ` and ${count(report.registryFiles, 'registry file')}` : ''}`;
  const verdict =
    report.errors === 0
      ? style.green(report.warnings ? `valid, with ${count(report.warnings, 'warning')}` : 'all valid')
      : style.red(`${count(report.errors, 'error')}${invalid ? ` in ${count(invalid, 'plan file')}` : ''}`) +
        (report.warnings ? `, ${count(report.warnings, 'warning')}` : '');
  const settings = settingsNote(report.settingsFile);
  if (report.planFiles === 0) lines.push(style.yellow(noPlanFilesHint(report.settingsFile)));
  lines.push(`${style.bold('Checked')} ${files}${settings}: ${verdict}.`);
  return lines.join('\n');
}

function settingsNote(settingsFile: string | undefined): string {
  return settingsFile ? ` (settings: ${settingsFile})` : ' (no settings file: defaults)';
}

/** What `validate` and `list` say in a repository with no plan file: where they looked, and how to write one. */
export function noPlanFilesHint(settingsFile: string | undefined): string {
  return `No plan files found${settingsNote(settingsFile)}. Create one with: plumbline new <flag-key>`;
}

export function count(n: number, noun: string): string {
  return `${n} ${noun}${n === 1 ? '' : 's'}`;
}
