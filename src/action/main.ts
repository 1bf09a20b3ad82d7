import * as core from '@actions/core';
import { createRepoFiles } from '../adapters/files.js';
import { renderValidationText } from '../core/report/validation.js';
import { formatProblem } from '../core/source/problem.js';
import { BUG_REPORT_HINT } from '../errors.js';
import { validateRepository } from '../run/validate.js';

/**
 * The Action entry point. For now it validates the repository's plans: problems become
 * annotations at their file and line, the summary lists them, and errors fail the job.
 */
async function main(): Promise<void> {
  const settingsPath = core.getInput('config') || undefined;
  const root = process.env.GITHUB_WORKSPACE ?? process.cwd();
  const outcome = await validateRepository({ files: createRepoFiles(root), ...(settingsPath ? { settingsPath } : {}) });
  if (outcome.kind === 'settings-invalid') {
    for (const p of outcome.problems) core.error(p.message, { file: p.file, startLine: p.line, startColumn: p.column, title: p.field });
    core.setFailed(`The settings file ${outcome.settingsFile} has errors; fix them and run again.`);
    return;
  }
  const { report } = outcome;
  for (const p of report.problems) {
    const annotate = p.severity === 'error' ? core.error : core.warning;
    annotate(formatProblem(p), { file: p.file, startLine: p.line, startColumn: p.column, title: `plumbline ${p.code}` });
  }
  core.setOutput('errors', report.errors);
  core.setOutput('warnings', report.warnings);
  await core.summary.addHeading('Plumbline: plan validation', 3).addCodeBlock(escapeHtml(renderValidationText(report, { color: false }))).write();
  if (report.errors > 0) core.setFailed(`${report.errors} error(s) in plan files.`);
}

/** Plan text reaches the job summary, which GitHub renders as HTML. */
function escapeHtml(text: string): string {
  return text.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;');
}

main().catch((error: unknown) => {
  core.setFailed(`internal error: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}\n${BUG_REPORT_HINT}`);
});
