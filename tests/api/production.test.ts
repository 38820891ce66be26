// In production the development helpers are not mounted: the caught-mail list must not exist there.
import type { ChildProcess } from 'node:child_process';
import request from 'supertest';
import { freePort, spawnTs, waitForOk } from '@/tests/setup/processes';

let child: ChildProcess;
let url: string;

beforeAll(async () => {
  const port = await freePort();
  url = `http://127.0.0.1:${port}`;
  child = spawnTs('server/index.ts', { ...process.env, NODE_ENV: 'production', TACTUS_PORT: String(port), TACTUS_PUBLIC_URL: url, TACTUS_DB_NAME: 'tactus_test' });
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
