import { createServer, request as httpRequest, type Server } from 'node:http';
import { connect, type Socket } from 'node:net';
import { describe, expect, it } from 'vitest';
import type { FakeGitHub, FakeGitHubModes } from '../helpers/fake-github.js';
import { CART_CODE_TOUCHED } from '../review/scenarios.js';
import { runAction } from './run-action.js';
import { actionScenarios } from './scenarios.js';

/**
 * How the bundled Action talks to GitHub when GitHub says no: the promises of the README's
 * "Limits" paragraph, checked against the fake GitHub's record of every request and its time.
 * The rules come from GitHub's REST documentation, "Rate limits for the REST API": on a secondary
 * limit (403 or 429 with retry-after) wait that many seconds; on a primary limit
 * (x-ratelimit-remaining: 0) wait until x-ratelimit-reset (epoch seconds); other 4xx are final.
 */
const scenarios = actionScenarios();
const setup = (modes: FakeGitHubModes = {}) => scenarios.setup({ 'src/cart.ts': CART_CODE_TOUCHED }, modes);

const CREATE_COMMENT = 'POST /repos/{owner}/{repo}/issues/{issue_number}/comments';
const LIST_COMMENTS = 'GET /repos/{owner}/{repo}/issues/{issue_number}/comments';

/** The first request GitHub refused with `status`, and the request after it. */
function limitedAndNext(github: FakeGitHub, status: number) {
  const index = github.requests.findIndex((r) => r.status === status);
  expect(index, 'the fake refused a request').toBeGreaterThanOrEqual(0);
  return { limited: github.requests[index]!, next: github.requests[index + 1]! };
}

describe('the bundled Action under GitHub’s limits', () => {
  it('sends a fork’s refused comment exactly once: 403 "Resource not accessible by integration" is final', async () => {
    const { repo, github, event } = await setup({ readOnly: true });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    expect(github.requests.filter((r) => r.operation === CREATE_COMMENT)).toHaveLength(1);
    expect(run.stdout).toContain('Resource not accessible by integration');
  });

  it.each([
    [404, 'Not Found', LIST_COMMENTS],
    [422, 'Validation Failed', CREATE_COMMENT],
  ])('never retries a %i', async (status, message, operation) => {
    const { repo, github, event } = await setup({ failing: { operation, status, message } });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(github.requests.filter((r) => r.operation === operation)).toHaveLength(1);
    expect(run.stdout).toContain(`HTTP ${status}`);
  });

  it.each([403, 429] as const)('waits exactly retry-after on a secondary rate limit (%i), with no request before the wait', async (status) => {
    const { repo, github, event } = await setup({ secondaryLimit: { times: 1, status, retryAfter: 2 } });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    const { limited, next } = limitedAndNext(github, status);
    expect(next.path).toBe(limited.path);
    expect(next.at - limited.at).toBeGreaterThanOrEqual(2000);
    expect(github.early).toEqual([]);
    expect(github.comments(7)).toHaveLength(1);
  });

  it('waits until x-ratelimit-reset on a primary rate limit, with no request before the reset', async () => {
    const { repo, github, event } = await setup({ primaryLimit: { resetIn: 2 } });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status, run.stdout).toBe(0);
    const { limited, next } = limitedAndNext(github, 403);
    // The reset is whole epoch seconds, so the wait is at least one second and at most the two asked for.
    expect(next.at).toBeGreaterThanOrEqual(Math.ceil(limited.at / 1000) * 1000 + 1000);
    expect(github.early).toEqual([]);
    expect(github.comments(7)).toHaveLength(1);
  });

  it('gives up with a clear message when a rate limit asks for a longer wait than rate-limit-wait allows', async () => {
    const { repo, github, event } = await setup({ secondaryLimit: { times: 1, status: 429, retryAfter: 30 } });
    const started = Date.now();
    const run = await runAction({ github, workspace: repo.root, event, inputs: { 'rate-limit-wait': '5' } });
    expect(Date.now() - started).toBeLessThan(20_000);
    expect(run.status).toBe(1);
    expect(run.stdout).toContain("GitHub's secondary rate limit asks to wait 30 seconds, longer than the 5 seconds this run may wait");
    expect(run.stdout).toContain('raise the rate-limit-wait input');
    expect(github.requests).toHaveLength(1);
  });

  it('gives up after three waits when the limit still holds', async () => {
    const { repo, github, event } = await setup({ secondaryLimit: { times: 4, status: 403, retryAfter: 1 } });
    const run = await runAction({ github, workspace: repo.root, event });
    expect(run.status).toBe(1);
    expect(run.stdout).toContain("GitHub's secondary rate limit still held after 3 waits");
    expect(github.requests).toHaveLength(4);
    expect(github.early).toEqual([]);
  });

  it('counts every HTTP request against request-budget, retries included', async () => {
    const { repo, github, event } = await setup({ failing: { operation: LIST_COMMENTS, status: 502, message: 'Bad Gateway', times: 1 } });
    // 450 comments: five pages to list, so the run needs 5 + 1 retry + 1 create + 5 = 12 requests.
    for (let i = 0; i < 450; i++) github.addComment(7, `chatter ${i}`, 'someone');
    const run = await runAction({ github, workspace: repo.root, event, inputs: { 'request-budget': '10' } });
    expect(run.status).toBe(1);
    expect(run.stdout).toContain('budget of 10 GitHub requests');
    expect(github.requests.filter((r) => r.status === 502)).toHaveLength(1);
    expect(github.requests).toHaveLength(10);
  });

  it('sends its requests through the runner’s proxy (HTTPS_PROXY / HTTP_PROXY)', async () => {
    const { repo, github, event } = await setup();
    const proxy = await startProxy(github.url);
    scenarios.track(proxy);
    // A name only the proxy can reach: without the proxy, the run cannot resolve it at all.
    // Loopback addresses are never proxied by @actions/http-client, so the API URL must not be one.
    const apiUrl = `http://api.github.test:${new URL(github.url).port}`;
    const run = await runAction({ github, workspace: repo.root, event, env: { GITHUB_API_URL: apiUrl, HTTP_PROXY: proxy.url, HTTPS_PROXY: proxy.url } });
    expect(run.status, run.stdout).toBe(0);
    expect(proxy.seen.length).toBeGreaterThan(0);
    expect(proxy.seen.every((target) => target.startsWith('api.github.test:'))).toBe(true);
    expect(github.comments(7)).toHaveLength(1);
  });
});

/**
 * A loopback HTTP proxy: CONNECT tunnels (what undici's proxy agent sends) and absolute-form
 * requests, both sent on to the fake GitHub whatever host they name. `seen` lists the targets.
 */
async function startProxy(upstream: string): Promise<{ url: string; seen: string[]; close(): Promise<void> }> {
  const target = new URL(upstream);
  const seen: string[] = [];
  const sockets = new Set<Socket>();
  const server: Server = createServer((req, res) => {
    const url = new URL(req.url ?? '/');
    seen.push(url.host);
    const forward = httpRequest({ host: target.hostname, port: target.port, method: req.method, path: `${url.pathname}${url.search}`, headers: req.headers }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    req.pipe(forward);
  });
  server.on('connect', (req, client: Socket, head: Buffer) => {
    seen.push(req.url ?? '');
    const tunnel = connect(Number(target.port), target.hostname, () => {
      client.write('HTTP/1.1 200 Connection Established\r\n\r\n');
      tunnel.write(head);
      tunnel.pipe(client);
      client.pipe(tunnel);
    });
    for (const s of [client, tunnel]) {
      sockets.add(s);
      s.on('error', () => s.destroy());
      s.on('close', () => sockets.delete(s));
    }
  });
  server.on('connection', (s: Socket) => {
    sockets.add(s);
    s.on('close', () => sockets.delete(s));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    seen,
    close: () =>
      new Promise((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}
