// In production the development helpers are not mounted: the caught-mail list must not exist there.
import { spawn, type ChildProcess } from 'node:child_process';
import net from 'node:net';
import path from 'node:path';
import request from 'supertest';

const root = path.resolve(__dirname, '../..');
let child: ChildProcess;
let url: string;

const freePort = () =>
  new Promise<number>((resolve) => {
    const s = net.createServer().listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });

beforeAll(async () => {
  const port = await freePort();
  url = `http://127.0.0.1:${port}`;
  child = spawn(path.join(root, 'node_modules/.bin/tsx'), [path.join(root, 'server/index.ts')], {
    env: { ...process.env, NODE_ENV: 'production', TACTUS_PORT: String(port), TACTUS_PUBLIC_URL: url, TACTUS_DB_NAME: 'tactus_test' },
    stdio: 'ignore',
  });
  for (let i = 0; i < 150; i++) {
    const ok = await fetch(`${url}/api/health`).then((r) => r.ok, () => false);
    if (ok) return;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error('production server did not start');
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
