// In production the development helpers are not mounted: the caught-mail list must not exist there.
import type { ChildProcess } from 'node:child_process';
import request from 'supertest';
import { freePort, spawnTs, waitForOk } from '@/tests/setup/processes';
import { toOpenApiPath } from '@/server/route-table';
import { appRoutes, documentedOperations } from './helpers';

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
