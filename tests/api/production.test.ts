// In production the development helpers are not mounted: the caught-mail list must not exist there. Production
// also needs its own signing secret, and marks cookies Secure when asked to (behind HTTPS).
import fs from 'node:fs';
import path from 'node:path';
import type { ChildProcess } from 'node:child_process';
import request from 'supertest';
import { freePort, spawnTs, waitForOk } from '@/tests/setup/processes';
import { toOpenApiPath } from '@/server/route-table';
import { agent, appRoutes, documentedOperations, PASSWORD, signedInUser } from './helpers';

const SECRET = 'a-production-secret-for-the-tests-only-0123456789';

let child: ChildProcess;
let url: string;

beforeAll(async () => {
  const port = await freePort();
  url = `http://127.0.0.1:${port}`;
  child = spawnTs('server/index.ts', {
    ...process.env,
    NODE_ENV: 'production',
    TACTUS_PORT: String(port),
    TACTUS_PUBLIC_URL: url,
    TACTUS_DB_NAME: 'tactus_test',
    TACTUS_AUTH_SECRET: SECRET,
    TACTUS_SECURE_COOKIES: '1',
  });
  await waitForOk(`${url}/api/health`, 30_000);
});
afterAll(() => {
  child?.kill('SIGTERM');
});

test('production mode serves the web build but no caught-mail list', async () => {
  const api = await request(url).get('/api/dev/mail');
  expect(api.status).toBe(404);
  const page = await request(url).get('/dev/mail');
  // The single-page app answers unknown paths with its own index.html, never with the mail list.
  expect(page.text).not.toContain('Caught mail');
  const home = await request(url).get('/').expect(200);
  expect(home.text).toContain('<div id="root">');
});

test('production serves the OpenAPI document, without the development routes, and no reference page', async () => {
  const doc = await request(url).get('/api/openapi.json').expect(200);
  expect(doc.body.openapi).toBe('3.1.0');
  // The production document names exactly the routes the production app mounts.
  const routes = appRoutes({ ...process.env, NODE_ENV: 'production', TACTUS_DB_NAME: 'tactus_test' });
  const ours = routes.filter((r) => toOpenApiPath(r.path) !== null).map((r) => `${r.method} ${toOpenApiPath(r.path)}`);
  expect(
    documentedOperations(doc.body)
      .filter((o) => !o.includes(' /api/auth/'))
      .sort(),
  ).toEqual(ours.sort());
  expect(ours).toContain('GET /api/openapi.json');
  expect(ours).not.toContain('GET /api/docs');
  expect(ours).not.toContain('GET /api/dev/mail');

  // The page and its scripts are not mounted: our API's 404, not the page.
  for (const path of ['/api/docs', '/api/docs/', '/api/docs/swagger-ui-init.js', '/api/docs/swagger-ui.css']) {
    const res = await request(url).get(path);
    expect({ path, status: res.status, code: res.body?.error?.code }).toEqual({ path, status: 404, code: 'not_found' });
  }
});

/** Starts a production server with `env` over the test settings; resolves with its exit code and output. */
function startProduction(env: Record<string, string | undefined>) {
  return new Promise<{ code: number | null; output: string }>((resolve) => {
    const childEnv: NodeJS.ProcessEnv = {
      ...process.env,
      NODE_ENV: 'production',
      TACTUS_PORT: '1',
      TACTUS_DB_NAME: 'tactus_test',
    };
    Object.assign(childEnv, env);
    const proc = spawnTs('server/index.ts', childEnv, ['ignore', 'pipe', 'pipe']);
    let output = '';
    proc.stdout!.on('data', (c: Buffer) => (output += c.toString()));
    proc.stderr!.on('data', (c: Buffer) => (output += c.toString()));
    // Port 1 cannot be listened on: a server that got past its checks would fail later, with other words.
    proc.on('exit', (code) => resolve({ code, output }));
  });
}

test.each([
  ['without TACTUS_AUTH_SECRET', { TACTUS_AUTH_SECRET: undefined }, /TACTUS_AUTH_SECRET is not set/],
  ['with a short TACTUS_AUTH_SECRET', { TACTUS_AUTH_SECRET: 'short' }, /shorter than 32 characters/],
])(
  'production refuses to start %s, and says why',
  async (_what, env, words) => {
    const { code, output } = await startProduction(env);
    expect(code).toBe(1);
    expect(output).toMatch(/will not start in production/);
    expect(output).toMatch(words);
  },
  30_000,
);

test('behind HTTPS (TACTUS_SECURE_COOKIES=1) the session cookie is Secure', async () => {
  const player = await signedInUser('secure-cookie'); // confirmed on the development test server, same database
  const res = await agent(url).post('/api/auth/sign-in/email').send({ email: player.email, password: PASSWORD });
  expect(res.status).toBe(200);
  const cookies = ([] as string[]).concat(res.headers['set-cookie'] ?? []);
  const session = cookies.find((c) => /session_token=/.test(c));
  expect(session).toMatch(/^__Secure-/);
  expect(session).toMatch(/;\s*Secure/i);
  expect(session).toMatch(/;\s*HttpOnly/i);
});

test('the development server says at start that its helpers are on, and that production has none', () => {
  const env = JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!) as Record<string, string>;
  const log = fs.readFileSync(path.join(env.TACTUS_STATE!, 'logs', 'test-server.log'), 'utf8');
  expect(log).toMatch(
    /development helpers are on \(caught mail at \/dev\/mail.*never mounted with NODE_ENV=production/,
  );
});
