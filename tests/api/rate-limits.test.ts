// Rate limits hold in every mode and across server processes (finding of the security review in the issue
// tracker: thirty wrong passwords in eight seconds, then the right one, all went through). 429 and Retry-After
// from RFC 6585 §4 and RFC 9110 §10.2.3. A second server on the test database (the same rate_limits table)
// runs beside the global one: sign-in at the normal limits, the other limits small so a test reaches them.
import type { ChildProcess } from 'node:child_process';
import request from 'supertest';
import { agent, baseUrl, PASSWORD, query, signedInUser, testAddress, uniqueEmail, type TestServer } from './helpers';
import { freePort, spawnTs, waitForOk } from '@/tests/setup/processes';

const serverEnv = JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!) as NodeJS.ProcessEnv;
const SMALL = { uploads: 3, invitations: 2, mailsPerAccount: 2, signUps: 3 };

let child: ChildProcess;
let second: TestServer;

beforeAll(async () => {
  const port = await freePort();
  const url = `http://127.0.0.1:${port}`;
  second = { name: 'second', url, db: 'tactus_test', spool: `${serverEnv.TACTUS_SPOOL_DIR}-second` };
  child = spawnTs('server/index.ts', {
    ...serverEnv,
    TACTUS_PORT: String(port),
    TACTUS_PUBLIC_URL: url,
    TACTUS_SPOOL_DIR: second.spool,
    TACTUS_RATE_UPLOADS: String(SMALL.uploads),
    TACTUS_RATE_INVITATIONS: String(SMALL.invitations),
    TACTUS_RATE_MAILS_PER_ACCOUNT: String(SMALL.mailsPerAccount),
    TACTUS_RATE_SIGNUPS: String(SMALL.signUps),
  });
  await waitForOk(`${url}/api/health`, 60_000);
}, 70_000);
afterAll(() => {
  child?.kill('SIGTERM');
});

const expectTooMany = (res: request.Response, words: RegExp) => {
  expect(res.status).toBe(429);
  expect(res.body.error.code).toBe('too_many_requests');
  expect(res.body.error.message).toMatch(words);
  expect(res.body.error.message).toMatch(/Try again in \d+ (second|minute)s?[.,]/);
  expect(Number(res.headers['retry-after'])).toBeGreaterThan(0);
  expect(res.body.error.requestId).toBe(res.headers['x-request-id']);
};

test('ten wrong passwords for one account from one address, on either server, lock that pair out for 15 minutes', async () => {
  const player = await signedInUser('lockout');
  const address = testAddress();
  const signIn = (url: string, password: string, from = address) =>
    agent(url, from).post('/api/auth/sign-in/email').send({ email: player.email, password });
  // The default: 10 failed sign-ins per account and address in 15 minutes (server/config.ts); half on each server.
  for (let i = 0; i < 10; i++) {
    const res = await signIn(i % 2 ? second.url : baseUrl, `wrong-guess-${i}`);
    expect(res.status).toBe(401);
    expect(res.body.requestId).toBe(res.headers['x-request-id']); // better-auth's own refusal, with our id
  }
  // The right password straight after is refused too, by either server: the count is shared.
  for (const url of [baseUrl, second.url]) {
    const res = await signIn(url, PASSWORD);
    expectTooMany(res, /wrong passwords/);
    expect(res.body.error.message).toMatch(
      /Try again in 1?\d minutes, or choose a new one with “Forgot your password\?”\.$/,
    );
    expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(15 * 60);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(14 * 60);
  }
  // The owner signing in from elsewhere is not locked out by a stranger's guessing.
  expect((await signIn(baseUrl, PASSWORD, testAddress())).status).toBe(200);
});

test('a right password clears the count, so a player who mistypes now and then is never locked out', async () => {
  const player = await signedInUser('mistyper');
  const a = agent(baseUrl);
  for (let round = 0; round < 2; round++) {
    for (let i = 0; i < 9; i++)
      await a.post('/api/auth/sign-in/email').send({ email: player.email, password: 'typo' }).expect(401);
    await a.post('/api/auth/sign-in/email').send({ email: player.email, password: PASSWORD }).expect(200);
  }
});

test('sign-ups from one address are counted by both servers together', async () => {
  const address = testAddress();
  const signUp = (url: string) =>
    agent(url, address)
      .post('/api/auth/sign-up/email')
      .send({ name: 'Many Accounts', email: uniqueEmail('many'), password: PASSWORD });
  for (let i = 0; i < SMALL.signUps; i++) expect((await signUp(baseUrl)).status).toBe(200);
  // The first server (normal limit, 20) would take more; the second's limit is already used up by the first's.
  const refused = await signUp(second.url);
  expectTooMany(refused, /new accounts/);
  expect((await signUp(baseUrl)).status).toBe(200);
  // Another address is not held back.
  expect(
    (
      await agent(second.url)
        .post('/api/auth/sign-up/email')
        .send({ name: 'Elsewhere', email: uniqueEmail('else'), password: PASSWORD })
    ).status,
  ).toBe(200);
});

test('password-reset mails to one address are limited, whoever asks', async () => {
  const player = await signedInUser('forgetful', 'player', second);
  const ask = () =>
    agent(second.url)
      .post('/api/auth/request-password-reset')
      .send({ email: player.email, redirectTo: '/reset-password' });
  for (let i = 0; i < SMALL.mailsPerAccount; i++) expect((await ask()).status).toBe(200);
  expectTooMany(await ask(), /several mails to this address/);
});

test('invitations past the hourly limit are refused and send nothing', async () => {
  const teacher = await signedInUser('busy-teacher', 'teacher', second);
  const invite = () => teacher.agent.post('/api/invitations').send({ email: uniqueEmail('student') });
  for (let i = 0; i < SMALL.invitations; i++) expect((await invite()).status).toBe(202);
  expectTooMany(await invite(), /many invitations/);
  const sent = await query('tactus_test', 'SELECT id FROM studio_invitations WHERE teacherId = ?', [teacher.id]);
  expect(sent).toHaveLength(SMALL.invitations);
});

test('uploads past the hourly limit are refused before the file is read', async () => {
  const player = await signedInUser('prolific', 'player', second);
  const song = (await player.agent.post('/api/songs').send({ title: 'Ninety Takes Polka' }).expect(201)).body;
  // Attempts count whether or not the file was any good (here there is none: 400).
  for (let i = 0; i < SMALL.uploads; i++)
    expect((await player.agent.post(`/api/songs/${song.id}/recordings`).field('kind', 'take')).status).toBe(400);
  const res = await player.agent
    .post(`/api/songs/${song.id}/recordings`)
    .field('kind', 'take')
    .attach('file', Buffer.alloc(1024), 'take.wav');
  expectTooMany(res, /uploaded many recordings/);
  // Someone else's uploads are theirs to count.
  const other = await signedInUser('other-uploader', 'player', second);
  const theirs = (await other.agent.post('/api/songs').send({ title: 'Quiet Air' }).expect(201)).body;
  expect((await other.agent.post(`/api/songs/${theirs.id}/recordings`).field('kind', 'take')).status).toBe(400);
});

test('the counters keep no e-mail address, only a digest', async () => {
  const rows = await query<{ key: string }>('tactus_test', 'SELECT `key` FROM rate_limits');
  expect(rows.length).toBeGreaterThan(0);
  for (const { key } of rows) expect(key).not.toContain('@');
});
