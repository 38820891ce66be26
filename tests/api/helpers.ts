// Shared by the API tests: a supertest agent that keeps cookies, caught-mail polling, and account set-up.
import request from 'supertest';
import mariadb from 'mariadb';
import crypto from 'node:crypto';
import { execFileSync } from 'node:child_process';
import path from 'node:path';
import type { CaughtMail, Role } from '@/shared/schemas';
import type { RouteEntry } from '@/server/route-table';
import { encodeWavChannels } from '@/audio/playback/export';
import { clickTrack, steadyBeats } from '@/tests/unit/signals';

const root = path.resolve(__dirname, '../..');

export const baseUrl = process.env.TACTUS_TEST_URL!;

/** The two test servers: files on local disk, or in the fake S3 (each with its own database). */
export const servers = {
  disk: {
    name: 'disk',
    url: process.env.TACTUS_TEST_URL!,
    db: 'tactus_test',
    spool: process.env.TACTUS_TEST_DISK_SPOOL!,
  },
  s3: {
    name: 's3',
    url: process.env.TACTUS_TEST_S3_URL!,
    db: 'tactus_test_s3',
    spool: process.env.TACTUS_TEST_S3_SPOOL!,
  },
};
export type TestServer = (typeof servers)['disk'];

/**
 * A client of its own address (from 198.18.0.0/15, the range RFC 2544 sets aside for tests), as the reverse
 * proxy in front of the server would report it: the per-address rate limits then count each test's
 * requests apart, at their normal values. better-auth refuses cookie-bearing POSTs without an Origin, as a
 * browser would send it.
 */
export function agent(url = baseUrl, address = testAddress()) {
  return request.agent(url).set('Origin', url).set('X-Forwarded-For', address);
}

export const testAddress = () => `198.${18 + crypto.randomInt(2)}.${crypto.randomInt(256)}.${crypto.randomInt(1, 255)}`;

export const uniqueEmail = (label: string) => `${label}-${crypto.randomBytes(4).toString('hex')}@players.example`;

export async function waitForMail(to: string, subject: RegExp, timeoutMs = 10_000, url = baseUrl): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await request(url).get('/api/dev/mail').query({ to });
    const mail = (res.body.mails as CaughtMail[]).find((m) => subject.test(m.subject));
    if (mail) return mail;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no mail "${subject}" reached ${to} within ${timeoutMs} ms`);
}

/** The path and query of the first link in a caught mail that points at our server. */
export function linkPath(mail: CaughtMail, url = baseUrl): string {
  const link = mail.links.find((l) => l.startsWith(url));
  if (!link) throw new Error(`mail "${mail.subject}" has no link to ${url}`);
  return link.slice(url.length);
}

export const PASSWORD = 'metronome-at-96';

/** Signs up, confirms through the caught mail and signs in; returns the signed-in agent. */
export async function signedInUser(
  label: string,
  role: Role = 'player',
  server: TestServer = servers.disk,
  email = uniqueEmail(label),
) {
  const a = agent(server.url);
  await a
    .post('/api/auth/sign-up/email')
    .send({ name: `Test ${label}`, email, password: PASSWORD })
    .expect(200);
  const mail = await waitForMail(email, /confirm/i, 10_000, server.url);
  await a.get(linkPath(mail, server.url)).expect(302);
  if (role !== 'player') await setRoleDirectly(email, role, server.db);
  await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
  const me = await a.get('/api/me').expect(200);
  return { agent: a, email, id: me.body.id as string };
}

/** The first admin has to come from somewhere: tests write it into the database as an operator would. */
export async function setRoleDirectly(email: string, role: Role, database = 'tactus_test') {
  await query(database, 'UPDATE users SET role = ? WHERE email = ?', [role, email]);
}

/** One query on a test database, for checks the API does not expose (rows left behind, job counts). */
export async function query<T = Record<string, unknown>>(
  database: string,
  sql: string,
  params: unknown[] = [],
): Promise<T[]> {
  const conn = await mariadb.createConnection({
    host: '127.0.0.1',
    port: Number(process.env.TACTUS_DB_PORT ?? 3406),
    user: process.env.TACTUS_DB_USER ?? 'tactus',
    password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
    database,
  });
  try {
    return (await conn.query(sql, params)) as T[];
  } finally {
    await conn.end();
  }
}

/** Polls a recording until its analysis is done or failed; returns the recording. */
export async function waitForAnalysis(agent: ReturnType<typeof request.agent>, id: string, timeoutMs = 30_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const r = (await agent.get(`/api/recordings/${id}`).expect(200)).body;
    if (r.status === 'done' || r.status === 'failed') return r;
    if (Date.now() > until) throw new Error(`analysis of ${id} still ${r.status} after ${timeoutMs} ms`);
    await new Promise((res) => setTimeout(res, 200));
  }
}

/** `METHOD /path` for every operation of an OpenAPI document, the path in its OpenAPI form. */
export function documentedOperations(doc: { paths: Record<string, Record<string, unknown>> }): string[] {
  const methods = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace'];
  return Object.entries(doc.paths).flatMap(([path, item]) =>
    Object.keys(item)
      .filter((k) => methods.includes(k))
      .map((m) => `${m.toUpperCase()} ${path}`),
  );
}

/** The app's own route listing (server/scripts/routes.ts, run as a server with this environment would be built). */
export function appRoutes(env: NodeJS.ProcessEnv): RouteEntry[] {
  const out = execFileSync(
    process.execPath,
    ['--import', 'tsx', path.join(root, 'server/scripts/routes.ts'), '--json'],
    { cwd: root, env },
  );
  return JSON.parse(out.toString()) as RouteEntry[];
}

type Person = { agent: ReturnType<typeof request.agent>; email: string; id: string };

/** The token of the newest invitation link mailed to `email` (received after `since`, a Date.now() value). */
export async function invitationToken(email: string, url = baseUrl, since = 0): Promise<string> {
  const until = Date.now() + 10_000;
  while (Date.now() < until) {
    const res = await request(url).get('/api/dev/mail').query({ to: email });
    const mails = (res.body.mails as CaughtMail[])
      .filter((m) => /invites you/i.test(m.subject) && Date.parse(m.receivedAt) >= since)
      .sort((a, b) => Date.parse(b.receivedAt) - Date.parse(a.receivedAt));
    const token = mails[0] && /\/invitations\/([A-Za-z0-9_-]+)/.exec(linkPath(mails[0], url))?.[1];
    if (token) return token;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no invitation reached ${email} within 10 s`);
}

/** A teacher invites a student, and the student accepts through the mailed link: the consented way to link. */
export async function linkStudent(teacher: Person, student: Person, url = baseUrl) {
  const since = Date.now();
  await teacher.agent.post('/api/invitations').send({ email: student.email }).expect(202);
  const token = await invitationToken(student.email, url, since);
  const invitation = (await student.agent.get(`/api/invitations/token/${token}`).expect(200)).body;
  await student.agent.post(`/api/invitations/${invitation.id}/accept`).expect(200);
}

/**
 * A small upload (3 s of clicks, 48 KB) for requests that are refused: a refused person is answered before the
 * body is read, and a body that fits the socket's buffer is written whole before that answer arrives (a large
 * one can meet the closed connection half-way: EPIPE instead of a status to check).
 */
export const smallUpload = Buffer.from(encodeWavChannels([clickTrack(steadyBeats(120, 3), 3, 8000)], 8000));
