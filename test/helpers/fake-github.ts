import { createServer, type IncomingMessage, type Server, type ServerResponse } from 'node:http';
import { readFileSync } from 'node:fs';
import { Ajv, type ValidateFunction } from 'ajv';

/**
 * A loopback stand-in for GitHub's REST API: only the operations Plumbline calls, with state
 * (comments, issues, pull-request files), a record of every request, a refusal for anything
 * unknown, and a check of every request and response body against GitHub's published OpenAPI
 * description (the pinned subset in test/fixtures/github/openapi-subset.json).
 */
interface Operation {
  operationId: string;
  requestBody: object | null;
  responses: Record<string, object | null>;
}

const subset = JSON.parse(readFileSync(new URL('../fixtures/github/openapi-subset.json', import.meta.url), 'utf8')) as { operations: Record<string, Operation> };
// OpenAPI 3.0 schemas: `nullable` and `example` are part of them, formats are not checked.
const ajv = new Ajv({ strict: false, allErrors: true, validateFormats: false });
const validators = new Map<string, ValidateFunction>();
/**
 * OpenAPI 3.0 lets `nullable` stand beside allOf/oneOf without a `type`; JSON Schema (and Ajv)
 * need that said as "this schema, or null".
 */
function asJsonSchema(node: unknown): unknown {
  if (Array.isArray(node)) return node.map(asJsonSchema);
  if (node === null || typeof node !== 'object') return node;
  const { nullable, ...rest } = node as Record<string, unknown>;
  const converted = Object.fromEntries(Object.entries(rest).map(([k, v]) => [k, asJsonSchema(v)]));
  if (nullable === true && converted.type === undefined) return { anyOf: [converted, { type: 'null' }] };
  return nullable === undefined ? converted : { ...converted, nullable };
}

function validator(key: string, schema: object): ValidateFunction {
  let v = validators.get(key);
  if (!v) {
    v = ajv.compile(asJsonSchema(schema) as object);
    validators.set(key, v);
  }
  return v;
}

export interface RecordedRequest {
  method: string;
  path: string;
  operation?: string;
  body?: unknown;
  /** When it arrived (Date.now()), to measure waits. */
  at: number;
  /** The status the fake answered with. */
  status?: number;
}

export interface FakeGitHubModes {
  /** Every write answers 403, as a fork's read-only token gets. */
  readOnly?: boolean;
  /**
   * The first `times` requests answer a secondary rate limit (GitHub: 403 or 429 with retry-after
   * and a message naming the secondary rate limit). Any request that arrives before retry-after
   * has passed is refused again and counted in `early`.
   */
  secondaryLimit?: { times: number; status: 403 | 429; retryAfter: number };
  /**
   * The first request answers a primary rate limit: 403 with x-ratelimit-remaining: 0 and
   * x-ratelimit-reset `resetIn` seconds ahead (epoch seconds). Every request before the reset is
   * refused again and counted in `early`.
   */
  primaryLimit?: { resetIn: number };
  /** Requests of this operation ("POST /repos/{owner}/{repo}/issues/{issue_number}/comments") answer `status`: the first `times` of them, or all. */
  failing?: { operation: string; status: number; message: string; times?: number };
  /** After a comment or issue is created, the next `times` listings leave it out (GitHub's listings can lag behind a write). */
  listingLag?: number;
  /** Comment bodies longer than this answer 422 (GitHub's limit is 65,536). */
  bodyLimit?: number;
}

interface StoredIssue {
  number: number;
  title: string;
  body: string;
  labels: string[];
  state: 'open' | 'closed';
  login: string;
  created_at: string;
  updated_at: string;
  pullRequest: boolean;
}

interface StoredComment {
  id: number;
  issue: number;
  body: string;
  login: string;
  created_at: string;
  updated_at: string;
}

export interface FakeGitHub {
  url: string;
  owner: string;
  repo: string;
  requests: RecordedRequest[];
  /** Requests that matched no known operation, or whose bodies broke the description. */
  refused: string[];
  /** Requests that came while a rate limit said to wait. */
  early: RecordedRequest[];
  comments(issue: number): StoredComment[];
  addComment(issue: number, body: string, login: string): void;
  setPullRequestFiles(pr: number, files: { filename: string; status: string; patch?: string; previous_filename?: string }[]): void;
  issues(): StoredIssue[];
  addIssue(issue: { title: string; body: string; labels: string[]; login: string; pullRequest?: boolean; state?: 'open' | 'closed' }): void;
  modes: FakeGitHubModes;
  close(): Promise<void>;
}

const ROUTES: [string, RegExp][] = Object.keys(subset.operations).map((key) => {
  const [, path] = key.split(' ');
  return [key, new RegExp(`^${path!.replace(/\{[^}]+\}/g, '([^/]+)')}$`)];
});

function user(login: string) {
  const url = `https://api.github.com/users/${encodeURIComponent(login)}`;
  return {
    login,
    id: 41898282,
    node_id: 'MDM6Qm90NDE4OTgyODI=',
    avatar_url: 'https://avatars.githubusercontent.com/in/15368?v=4',
    gravatar_id: '',
    url,
    html_url: `https://github.com/apps/${login}`,
    followers_url: `${url}/followers`,
    following_url: `${url}/following{/other_user}`,
    gists_url: `${url}/gists{/gist_id}`,
    starred_url: `${url}/starred{/owner}{/repo}`,
    subscriptions_url: `${url}/subscriptions`,
    organizations_url: `${url}/orgs`,
    repos_url: `${url}/repos`,
    events_url: `${url}/events{/privacy}`,
    received_events_url: `${url}/received_events`,
    type: login.endsWith('[bot]') ? 'Bot' : 'User',
    site_admin: false,
  };
}

export async function startFakeGitHub(options: { owner?: string; repo?: string; modes?: FakeGitHubModes; botLogin?: string } = {}): Promise<FakeGitHub> {
  const owner = options.owner ?? 'bramblecart';
  const repo = options.repo ?? 'shop';
  const modes: FakeGitHubModes = { ...options.modes };
  const botLogin = options.botLogin ?? 'github-actions[bot]';
  const requests: RecordedRequest[] = [];
  const refused: string[] = [];
  const early: RecordedRequest[] = [];
  // A rate limit in force: requests before this time (ms) are refused with these headers.
  let limitedUntil = 0;
  let limitResponse: { status: number; message: string; headers: Record<string, string> } | undefined;
  // The newest created comment id or issue number, hidden from the next `listingLag` listings.
  let lagging: { kind: 'comment' | 'issue'; id: number; left: number } | undefined;
  const store: StoredComment[] = [];
  const files = new Map<number, { filename: string; status: string; patch?: string; previous_filename?: string }[]>();
  const issues: StoredIssue[] = [];
  let nextIssue = 1;
  let nextId = 1000;
  let clock = Date.UTC(2026, 11, 1, 9, 0, 0);
  const now = () => new Date((clock += 1000)).toISOString().replace(/\.\d{3}Z$/, 'Z');

  const commentJson = (c: StoredComment) => ({
    id: c.id,
    node_id: `IC_${c.id}`,
    url: `https://api.github.com/repos/${owner}/${repo}/issues/comments/${c.id}`,
    html_url: `https://github.com/${owner}/${repo}/pull/${c.issue}#issuecomment-${c.id}`,
    body: c.body,
    user: user(c.login),
    created_at: c.created_at,
    updated_at: c.updated_at,
    issue_url: `https://api.github.com/repos/${owner}/${repo}/issues/${c.issue}`,
    author_association: 'NONE',
  });

  const issueJson = (i: StoredIssue) => ({
    id: 5000 + i.number,
    node_id: `I_${i.number}`,
    url: `https://api.github.com/repos/${owner}/${repo}/issues/${i.number}`,
    repository_url: `https://api.github.com/repos/${owner}/${repo}`,
    labels_url: `https://api.github.com/repos/${owner}/${repo}/issues/${i.number}/labels{/name}`,
    comments_url: `https://api.github.com/repos/${owner}/${repo}/issues/${i.number}/comments`,
    events_url: `https://api.github.com/repos/${owner}/${repo}/issues/${i.number}/events`,
    html_url: `https://github.com/${owner}/${repo}/issues/${i.number}`,
    number: i.number,
    state: i.state,
    title: i.title,
    body: i.body,
    user: user(i.login),
    labels: i.labels.map((name, n) => ({ id: n + 1, node_id: `LA_${n}`, url: `https://api.github.com/repos/${owner}/${repo}/labels/${name}`, name, color: 'ededed', default: false, description: null })),
    assignee: null,
    milestone: null,
    locked: false,
    comments: 0,
    closed_at: i.state === 'closed' ? i.updated_at : null,
    created_at: i.created_at,
    updated_at: i.updated_at,
    author_association: 'NONE',
    ...(i.pullRequest ? { pull_request: { url: `https://api.github.com/repos/${owner}/${repo}/pulls/${i.number}`, html_url: `https://github.com/${owner}/${repo}/pull/${i.number}`, diff_url: null, patch_url: null } } : {}),
  });

  const server: Server = createServer((req: IncomingMessage, res: ServerResponse) => {
    const chunks: Buffer[] = [];
    req.on('data', (c: Buffer) => chunks.push(c));
    req.on('end', () => {
      try {
        handle();
      } catch (error) {
        refused.push(`the fake itself failed: ${error instanceof Error ? error.message : String(error)}`);
        res.writeHead(500, { 'content-type': 'application/json' });
        res.end(JSON.stringify({ message: 'fake failure' }));
      }
    });
    const handle = () => {
      const url = new URL(req.url ?? '/', 'http://localhost');
      const method = (req.method ?? 'GET').toUpperCase();
      const text = Buffer.concat(chunks).toString('utf8');
      const body = text ? (JSON.parse(text) as unknown) : undefined;
      const route = ROUTES.find(([key, re]) => key.startsWith(`${method} `) && re.test(url.pathname));
      const recorded: RecordedRequest = { method, path: `${url.pathname}${url.search}`, ...(route ? { operation: route[0] } : {}), ...(body !== undefined ? { body } : {}), at: Date.now() };
      requests.push(recorded);
      const send = (status: number, payload: unknown, headers: Record<string, string> = {}) => {
        recorded.status = status;
        if (route && payload !== undefined) {
          const schema = subset.operations[route[0]]!.responses[String(status)];
          if (schema) {
            const check = validator(`${route[0]} ${status}`, schema);
            if (!check(payload)) refused.push(`response of ${route[0]} ${status}: ${ajv.errorsText(check.errors)}`);
          }
        }
        res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', ...headers });
        res.end(payload === undefined ? '' : JSON.stringify(payload));
      };
      if (!route) {
        refused.push(`${method} ${url.pathname}`);
        return send(404, { message: 'Not Found', documentation_url: 'https://docs.github.com/rest' });
      }
      const [key, re] = route;
      const params = re.exec(url.pathname)!.slice(1).map(decodeURIComponent);
      if (params[0] !== owner || params[1] !== repo) {
        refused.push(`${method} ${url.pathname}: wrong repository`);
        return send(404, { message: 'Not Found', documentation_url: 'https://docs.github.com/rest' });
      }
      const operation = subset.operations[key]!;
      if (operation.requestBody && body !== undefined) {
        const check = validator(`${key} request`, operation.requestBody);
        if (!check(body)) refused.push(`request of ${key}: ${ajv.errorsText(check.errors)}`);
      }
      const rateLimited = (status: number, message: string, headers: Record<string, string>) =>
        send(status, { message, documentation_url: 'https://docs.github.com/rest/using-the-rest-api/rate-limits-for-the-rest-api' }, headers);
      if (Date.now() < limitedUntil && limitResponse) {
        early.push(recorded);
        return rateLimited(limitResponse.status, limitResponse.message, limitResponse.headers);
      }
      if (modes.secondaryLimit && modes.secondaryLimit.times > 0) {
        modes.secondaryLimit.times--;
        const { status, retryAfter } = modes.secondaryLimit;
        limitedUntil = Date.now() + retryAfter * 1000;
        limitResponse = { status, message: 'You have exceeded a secondary rate limit. Please wait a few minutes before you try again.', headers: { 'retry-after': String(retryAfter) } };
        return rateLimited(limitResponse.status, limitResponse.message, limitResponse.headers);
      }
      if (modes.primaryLimit) {
        const reset = Math.ceil(Date.now() / 1000) + modes.primaryLimit.resetIn;
        modes.primaryLimit = undefined;
        limitedUntil = reset * 1000;
        limitResponse = {
          status: 403,
          message: 'API rate limit exceeded for installation ID 1.',
          headers: { 'x-ratelimit-limit': '1000', 'x-ratelimit-remaining': '0', 'x-ratelimit-used': '1000', 'x-ratelimit-reset': String(reset), 'x-ratelimit-resource': 'core' },
        };
        return rateLimited(limitResponse.status, limitResponse.message, limitResponse.headers);
      }
      if (modes.failing && modes.failing.operation === key && (modes.failing.times === undefined || modes.failing.times-- > 0)) {
        return send(modes.failing.status, { message: modes.failing.message, documentation_url: 'https://docs.github.com/rest' });
      }
      const hidden = (kind: 'comment' | 'issue', id: number) => {
        if (!lagging || lagging.kind !== kind || lagging.id !== id || lagging.left <= 0) return false;
        return true;
      };
      const listed = (kind: 'comment' | 'issue') => {
        if (lagging?.kind === kind && lagging.left > 0) lagging.left--;
      };
      const write = method !== 'GET';
      if (write && modes.readOnly) return send(403, { message: 'Resource not accessible by integration', documentation_url: 'https://docs.github.com/rest/issues/comments#create-an-issue-comment', status: '403' });

      const page = Number(url.searchParams.get('page') ?? '1');
      const perPage = Math.min(100, Number(url.searchParams.get('per_page') ?? '30'));
      const paged = <T>(all: T[], base: string) => {
        const last = Math.max(1, Math.ceil(all.length / perPage));
        const link = (p: number, rel: string) => {
          // Keep the other query parameters (labels, state) as GitHub does.
          const next = new URL(base);
          url.searchParams.forEach((v, k) => next.searchParams.set(k, v));
          next.searchParams.set('per_page', String(perPage));
          next.searchParams.set('page', String(p));
          return `<${next.toString()}>; rel="${rel}"`;
        };
        const links = [...(page < last ? [link(page + 1, 'next'), link(last, 'last')] : []), ...(page > 1 ? [link(1, 'first'), link(page - 1, 'prev')] : [])];
        const headers: Record<string, string> = links.length ? { link: links.join(', ') } : {};
        return { items: all.slice((page - 1) * perPage, page * perPage), headers };
      };
      const self = `http://${req.headers.host}${url.pathname}`;

      switch (key) {
        case 'GET /repos/{owner}/{repo}/issues/{issue_number}/comments': {
          const { items, headers } = paged(store.filter((c) => c.issue === Number(params[2]) && !hidden('comment', c.id)), self);
          listed('comment');
          return send(200, items.map(commentJson), headers);
        }
        case 'POST /repos/{owner}/{repo}/issues/{issue_number}/comments': {
          const b = body as { body: string };
          if (modes.bodyLimit && b.body.length > modes.bodyLimit) return send(422, { message: 'Validation Failed', errors: [{ resource: 'IssueComment', code: 'custom', field: 'body', message: 'body is too long (maximum is 65536 characters)' }], documentation_url: 'https://docs.github.com/rest/issues/comments#create-an-issue-comment' });
          const at = now();
          const c = { id: nextId++, issue: Number(params[2]), body: b.body, login: botLogin, created_at: at, updated_at: at };
          store.push(c);
          if (modes.listingLag) lagging = { kind: 'comment', id: c.id, left: modes.listingLag };
          return send(201, commentJson(c), { location: `https://api.github.com/repos/${owner}/${repo}/issues/comments/${c.id}` });
        }
        case 'PATCH /repos/{owner}/{repo}/issues/comments/{comment_id}': {
          const c = store.find((x) => x.id === Number(params[2]));
          if (!c) return send(404, { message: 'Not Found', documentation_url: 'https://docs.github.com/rest' });
          const b = body as { body: string };
          if (modes.bodyLimit && b.body.length > modes.bodyLimit) return send(422, { message: 'Validation Failed', errors: [], documentation_url: 'https://docs.github.com/rest' });
          c.body = b.body;
          c.updated_at = now();
          return send(200, commentJson(c));
        }
        case 'DELETE /repos/{owner}/{repo}/issues/comments/{comment_id}': {
          const index = store.findIndex((x) => x.id === Number(params[2]));
          if (index < 0) return send(404, { message: 'Not Found', documentation_url: 'https://docs.github.com/rest' });
          store.splice(index, 1);
          res.writeHead(204);
          return res.end();
        }
        case 'GET /repos/{owner}/{repo}/pulls/{pull_number}/files': {
          const all = (files.get(Number(params[2])) ?? []).slice(0, 3000);
          const { items, headers } = paged(all, self);
          const shaped = items.map((f, i) => ({
            sha: `${String(i).padStart(40, 'a')}`.slice(-40),
            filename: f.filename,
            status: f.status,
            additions: 1,
            deletions: 0,
            changes: 1,
            blob_url: `https://github.com/${owner}/${repo}/blob/x/${f.filename}`,
            raw_url: `https://github.com/${owner}/${repo}/raw/x/${f.filename}`,
            contents_url: `https://api.github.com/repos/${owner}/${repo}/contents/${f.filename}`,
            ...(f.patch ? { patch: f.patch } : {}),
            ...(f.previous_filename ? { previous_filename: f.previous_filename } : {}),
          }));
          return send(200, shaped, headers);
        }
        case 'GET /repos/{owner}/{repo}/issues': {
          const label = url.searchParams.get('labels');
          const state = url.searchParams.get('state') ?? 'open';
          const all = issues.filter((i) => (state === 'all' || i.state === state) && (!label || label.split(',').every((l) => i.labels.includes(l))) && !hidden('issue', i.number));
          const { items, headers } = paged(all, self);
          listed('issue');
          return send(200, items.map(issueJson), headers);
        }
        case 'POST /repos/{owner}/{repo}/issues': {
          const b = body as { title: string; body?: string; labels?: string[] };
          if (modes.bodyLimit && (b.body ?? '').length > modes.bodyLimit) return send(422, { message: 'Validation Failed', errors: [], documentation_url: 'https://docs.github.com/rest' });
          const at = now();
          const issue: StoredIssue = { number: nextIssue++, title: String(b.title), body: b.body ?? '', labels: b.labels ?? [], state: 'open', login: botLogin, created_at: at, updated_at: at, pullRequest: false };
          issues.push(issue);
          if (modes.listingLag) lagging = { kind: 'issue', id: issue.number, left: modes.listingLag };
          return send(201, issueJson(issue));
        }
        case 'PATCH /repos/{owner}/{repo}/issues/{issue_number}': {
          const issue = issues.find((i) => i.number === Number(params[2]));
          if (!issue) return send(404, { message: 'Not Found', documentation_url: 'https://docs.github.com/rest' });
          const b = body as { body?: string; state?: 'open' | 'closed' };
          if (b.body !== undefined) issue.body = b.body;
          if (b.state) issue.state = b.state;
          issue.updated_at = now();
          return send(200, issueJson(issue));
        }
        default:
          refused.push(`${key}: known to the description but not served by this fake`);
          return send(404, { message: 'Not Found', documentation_url: 'https://docs.github.com/rest' });
      }
    };
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    owner,
    repo,
    requests,
    refused,
    early,
    comments: (issue) => store.filter((c) => c.issue === issue),
    addComment(issue, body, login) {
      const at = now();
      store.push({ id: nextId++, issue, body, login, created_at: at, updated_at: at });
    },
    setPullRequestFiles: (pr, list) => files.set(pr, list),
    issues: () => issues,
    addIssue(issue) {
      const at = now();
      issues.push({ number: nextIssue++, title: issue.title, body: issue.body, labels: issue.labels, state: issue.state ?? 'open', login: issue.login, created_at: at, updated_at: at, pullRequest: issue.pullRequest ?? false });
    },
    modes,
    close: () => new Promise((resolve) => server.close(() => resolve())),
  };
}
