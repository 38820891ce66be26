// Findings of the security review in the issue tracker: bounded sign-in bodies, checked account fields,
// security headers, the Origin check, request ids in answers and logs. HTTP semantics from RFC 9110 (413,
// 403); the headers from the CSP Level 3 and Fetch standards (W3C, WHATWG).
import fs from 'node:fs';
import http from 'node:http';
import path from 'node:path';
import request from 'supertest';
import { baseUrl, PASSWORD, query, signedInUser, uniqueEmail } from './helpers';

const serverEnv = JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!) as Record<string, string>;
const serverLog = path.join(serverEnv.TACTUS_STATE!, 'logs', 'test-server.log');

let player: Awaited<ReturnType<typeof signedInUser>>;
beforeAll(async () => {
  player = await signedInUser('guarded');
});

/** Sends headers and a little of a body by hand, and reports when and what the server answers. */
function partialPost(pathname: string, headers: Record<string, string>, chunks: Buffer[], end = false) {
  return new Promise<{ status: number; body: string; ms: number }>((resolve, reject) => {
    const started = Date.now();
    const req = http.request(`${baseUrl}${pathname}`, { method: 'POST', headers }, (res) => {
      let body = '';
      res.on('data', (c: Buffer) => (body += c.toString()));
      res.on('end', () => {
        req.destroy(); // the rest of the body is never sent
        resolve({ status: res.statusCode!, body, ms: Date.now() - started });
      });
    });
    // The server may close the socket once it has answered; that is the point, not a failure.
    req.on('error', (err: NodeJS.ErrnoException) =>
      err.code === 'EPIPE' || err.code === 'ECONNRESET' ? 0 : reject(err),
    );
    for (const c of chunks) req.write(c);
    if (end) req.end();
  });
}

describe('sign-in routes read bounded bodies', () => {
  test('a sign-in that declares 100 MB is refused with 413 before its body is read', async () => {
    const res = await partialPost(
      '/api/auth/sign-in/email',
      { 'Content-Type': 'application/json', 'Content-Length': String(100 * 1024 * 1024), Origin: baseUrl },
      [Buffer.from('{"email":"')],
    );
    expect(res.status).toBe(413);
    const body = JSON.parse(res.body);
    expect(body.error).toMatchObject({ code: 'too_large', message: 'the request body is too large' });
  });

  test.each([
    ['JSON', 'application/json'],
    ['form', 'application/x-www-form-urlencoded'],
    ['plain text', 'text/plain'],
  ])('a %s body streamed past the limit without a length gets 413', async (_name, type) => {
    // Chunked (no Content-Length): 2 MB in 64 KB pieces, the limit being 1 MB.
    const res = await partialPost(
      '/api/auth/sign-in/email',
      { 'Content-Type': type, 'Transfer-Encoding': 'chunked', Origin: baseUrl },
      Array.from({ length: 32 }, () => Buffer.alloc(64 * 1024, 'a')),
      true,
    );
    expect(res.status).toBe(413);
    expect(JSON.parse(res.body).error.code).toBe('too_large');
  });
});

describe('update-user stores only a plain, bounded name', () => {
  const storedName = async () =>
    (await query<{ name: string }>('tactus_test', 'SELECT name FROM users WHERE id = ?', [player.id]))[0]!.name;

  test.each([
    ['an array', { name: ['Ada'] }, 'name'],
    ['an object', { name: { first: 'Ada' } }, 'name'],
    ['a boolean', { name: true }, 'name'],
    ['a number too large for JSON numbers', '{"name":1e400}', 'name'],
    ['over 200 characters', { name: 'x'.repeat(201) }, 'name'],
    ['only spaces', { name: '   ' }, 'name'],
    ['a 900 KB picture', { image: `https://pictures.example/${'p'.repeat(900 * 1024)}` }, 'image'],
    ['a picture that is not a web address', { image: 'javascript:alert(1)' }, 'image'],
    ['an empty body', {}, '(body)'],
    ['a field it may not change', { email: 'someone@else.example' }, '(body)'],
  ])(
    'a name or picture as %s is refused with 400 in plain words, and nothing is stored',
    async (_what, body, field) => {
      const before = await storedName();
      const res = await player.agent
        .post('/api/auth/update-user')
        .set('Content-Type', 'application/json')
        .send(typeof body === 'string' ? body : JSON.stringify(body));
      expect(res.status).toBe(400);
      expect(res.body.error.field).toBe(field);
      expect(res.body.error.message).not.toMatch(/Invalid input|expected \w+, received/); // zod's words replaced by ours
      expect(await storedName()).toBe(before);
    },
  );

  test('a plain name is stored, trimmed', async () => {
    await player.agent.post('/api/auth/update-user').send({ name: '  Ada Quaver ' }).expect(200);
    expect(await storedName()).toBe('Ada Quaver');
  });

  test('sign-up refuses a name that is not text', async () => {
    const email = uniqueEmail('typed-name');
    const res = await request(baseUrl)
      .post('/api/auth/sign-up/email')
      .set('X-Forwarded-For', '198.18.200.1')
      .send({ name: true, email, password: PASSWORD });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('name');
    expect(await query('tactus_test', 'SELECT id FROM users WHERE email = ?', [email])).toHaveLength(0);
  });
});

describe('security headers', () => {
  test('the web app is served with a Content-Security-Policy its own page works under', async () => {
    const res = await request(baseUrl).get('/').expect(200);
    const csp = res.headers['content-security-policy'] as string;
    const directive = (name: string) =>
      csp
        .split(';')
        .map((d) => d.trim().split(/\s+/))
        .find(([n]) => n === name)
        ?.slice(1);
    // No inline script and no JS eval; 'wasm-unsafe-eval' allows compiling WebAssembly only (CSP Level 3), which
    // the player's stretcher needs.
    expect(directive('script-src')).toEqual(["'self'", "'wasm-unsafe-eval'"]);
    expect(directive('frame-ancestors')).toEqual(["'none'"]);
    expect(directive('object-src')).toEqual(["'none'"]);
    // The page the export wrote loads its scripts from this origin only, none inline (what script-src allows).
    const scripts = [...res.text.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attrs, inline] of scripts) {
      expect(attrs).toMatch(/src="\/[^/]/);
      expect(inline!.trim()).toBe('');
    }
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['referrer-policy']).toBe('strict-origin-when-cross-origin');
    expect(res.headers['x-frame-options']).toBe('DENY');
  });

  test('API answers carry the same headers, and no X-Powered-By', async () => {
    const res = await request(baseUrl).get('/api/health').expect(200);
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
    // Over plain http there is nothing to keep the browser on.
    expect(res.headers['strict-transport-security']).toBeUndefined();
  });
});

describe('state-changing requests from another site', () => {
  const songCount = async () =>
    (await query('tactus_test', 'SELECT id FROM songs WHERE ownerId = ?', [player.id])).length;

  test.each(['https://evil.example', 'null', 'http://127.0.0.1:1'])(
    'a POST with Origin %s is refused with 403 and changes nothing',
    async (origin) => {
      const before = await songCount();
      const res = await player.agent.post('/api/songs').set('Origin', origin).send({ title: 'Forged' });
      expect(res.status).toBe(403);
      expect(res.body.error.code).toBe('foreign_origin');
      expect(await songCount()).toBe(before);
    },
  );

  test('DELETE, PATCH and sign-in from another site are refused too', async () => {
    const song = (await player.agent.post('/api/songs').send({ title: 'Kept Reel' }).expect(201)).body;
    const evil = 'https://evil.example';
    expect((await player.agent.delete(`/api/songs/${song.id}`).set('Origin', evil)).status).toBe(403);
    expect((await player.agent.patch(`/api/songs/${song.id}`).set('Origin', evil).send({ title: 'x' })).status).toBe(
      403,
    );
    const signIn = await request(baseUrl)
      .post('/api/auth/sign-in/email')
      .set('Origin', evil)
      .send({ email: player.email, password: PASSWORD });
    expect(signIn.status).toBe(403);
    await player.agent.get(`/api/songs/${song.id}`).expect(200);
  });

  test('reading from another site, and writing from our own page or from a program without Origin, work', async () => {
    await player.agent.get('/api/songs').set('Origin', 'https://evil.example').expect(200);
    await player.agent.post('/api/songs').send({ title: 'Same Site Jig' }).expect(201); // Origin = the app
    const noOrigin = await request(baseUrl).post('/api/songs').send({ title: 'x' }); // supertest sends none
    expect(noOrigin.status).toBe(401); // let past the Origin check, stopped by the missing session
  });
});

describe('request ids', () => {
  test('a plain X-Request-Id is echoed in the header, the error body and the server log', async () => {
    const id = `probe-${Date.now()}`;
    const res = await request(baseUrl).get('/api/no-such-thing').set('X-Request-Id', id).expect(404);
    expect(res.headers['x-request-id']).toBe(id);
    expect(res.body.error.requestId).toBe(id);
    // The log line is written as the answer goes out; give the file a moment.
    let line: string | undefined;
    for (let i = 0; i < 50 && !line; i++) {
      line = fs
        .readFileSync(serverLog, 'utf8')
        .split('\n')
        .find((l) => l.includes(`"${id}"`));
      if (!line) await new Promise((r) => setTimeout(r, 100));
    }
    expect(JSON.parse(line!)).toMatchObject({
      req: { id, method: 'GET', path: '/api/no-such-thing' },
      res: { statusCode: 404 },
    });
  });

  test.each([
    ['too long', 'x'.repeat(65)],
    ['with spaces and markup', 'a b <script>'],
  ])('an X-Request-Id %s is replaced by one of ours', async (_what, given) => {
    const res = await request(baseUrl).get('/api/no-such-thing').set('X-Request-Id', given).expect(404);
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    expect(res.body.error.requestId).toBe(res.headers['x-request-id']);
  });

  test('every error body has a request id and no stack trace, API or not', async () => {
    const answers = [
      await request(baseUrl).get('/api/songs'), // 401
      await request(baseUrl).get('/%E0%A4%A'), // a broken escape outside the API
      await request(baseUrl).post('/api/songs').set('Content-Type', 'application/json').send('{"title":'),
      await player.agent.post('/api/songs').send({ title: '' }), // 400
    ];
    for (const res of answers) {
      expect(res.status).toBeGreaterThanOrEqual(400);
      expect(res.body.error.requestId).toBe(res.headers['x-request-id']);
      expect(res.text).not.toMatch(/\bat .*\.(ts|js):\d+/);
    }
  });

  test("better-auth's own refusals carry the request id in their body too, in their own shape", async () => {
    const { email } = player;
    const id = `auth-probe-${Date.now()}`;
    const answers = [
      // A wrong password: better-auth's 401 { code, message }.
      await request(baseUrl)
        .post('/api/auth/sign-in/email')
        .set('X-Request-Id', id)
        .send({ email, password: 'not-the-password' }),
      // A body its own validation refuses (no password).
      await request(baseUrl).post('/api/auth/sign-in/email').send({ email }),
      // A path it does not know (its answer has no body of its own).
      await request(baseUrl).get('/api/auth/no-such-endpoint'),
    ];
    expect(answers.map((r) => r.status)).toEqual([401, 400, 404]);
    expect(answers[0]!.body.requestId).toBe(id);
    expect(answers[0]!.body.code).toBe('INVALID_EMAIL_OR_PASSWORD');
    for (const res of answers) {
      expect(res.headers['content-type']).toMatch(/^application\/json/);
      expect(res.body.requestId).toBe(res.headers['x-request-id']);
      expect(typeof res.body.message).toBe('string');
      expect(res.text).not.toMatch(/\bat .*\.(ts|js):\d+/);
    }
    // A success is left as better-auth sent it.
    const ok = await player.agent.get('/api/auth/get-session').expect(200);
    expect(ok.body.user.email).toBe(email);
    expect(ok.body.requestId).toBeUndefined();
  });

  test('tokens in paths and queries are not written to the log', async () => {
    const token = `secret${Date.now()}`;
    await request(baseUrl).get(`/api/invitations/token/${token}`);
    await request(baseUrl).get(`/api/auth/verify-email?token=${token}`);
    await new Promise((r) => setTimeout(r, 300));
    expect(fs.readFileSync(serverLog, 'utf8')).not.toContain(token);
  });
});
