// Regenerates test/fixtures/github/openapi-subset.json: the operations Plumbline calls, cut out of
// GitHub's published OpenAPI description (npm @octokit/openapi, dereferenced api.github.com).
//   node scripts/extract-openapi-subset.mjs [path/to/api.github.com.deref.json]
// Without a path it fetches the pinned package version with npm pack into a temporary folder.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

const PACKAGE = '@octokit/openapi@23.0.2';
const OPERATIONS = [
  ['get', '/repos/{owner}/{repo}/issues/{issue_number}/comments'],
  ['post', '/repos/{owner}/{repo}/issues/{issue_number}/comments'],
  ['patch', '/repos/{owner}/{repo}/issues/comments/{comment_id}'],
  ['delete', '/repos/{owner}/{repo}/issues/comments/{comment_id}'],
  ['get', '/repos/{owner}/{repo}/pulls/{pull_number}/files'],
  ['get', '/repos/{owner}/{repo}/issues'],
  ['post', '/repos/{owner}/{repo}/issues'],
  ['patch', '/repos/{owner}/{repo}/issues/{issue_number}'],
];

let source = process.argv[2];
let temp;
if (!source) {
  temp = mkdtempSync(join(tmpdir(), 'openapi-'));
  const tarball = execFileSync('npm', ['pack', PACKAGE, '--silent'], { cwd: temp, encoding: 'utf8' }).trim();
  execFileSync('tar', ['-xzf', tarball, 'package/generated/api.github.com.deref.json'], { cwd: temp });
  source = join(temp, 'package/generated/api.github.com.deref.json');
}
const spec = JSON.parse(readFileSync(source, 'utf8'));
const subset = { source: `${PACKAGE} generated/api.github.com.deref.json`, openapi: spec.openapi, operations: {} };
for (const [method, path] of OPERATIONS) {
  const op = spec.paths[path]?.[method];
  if (!op) throw new Error(`${method} ${path} is not in the description`);
  const responses = {};
  for (const [status, response] of Object.entries(op.responses)) {
    responses[status] = response.content?.['application/json']?.schema ?? null;
  }
  subset.operations[`${method.toUpperCase()} ${path}`] = {
    operationId: op.operationId,
    parameters: (op.parameters ?? []).map((p) => ({ name: p.name, in: p.in, required: Boolean(p.required), schema: p.schema })),
    requestBody: op.requestBody?.content?.['application/json']?.schema ?? null,
    responses,
  };
}
writeFileSync('test/fixtures/github/openapi-subset.json', `${JSON.stringify(subset, null, 1)}\n`);
if (temp) rmSync(temp, { recursive: true, force: true });
console.log(`wrote test/fixtures/github/openapi-subset.json (${Object.keys(subset.operations).length} operations)`);
