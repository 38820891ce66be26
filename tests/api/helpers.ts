// Shared by the API tests: a supertest agent that keeps cookies, caught-mail polling, and account set-up.
import request from 'supertest';
import mariadb from 'mariadb';
import crypto from 'node:crypto';
import type { CaughtMail, Role } from '../../shared/schemas';

export const baseUrl = process.env.TACTUS_TEST_URL!;

/** better-auth refuses cookie-bearing POSTs without an Origin, as a browser would send it. */
export function agent() {
  return request.agent(baseUrl).set('Origin', baseUrl);
}

export const uniqueEmail = (label: string) => `${label}-${crypto.randomBytes(4).toString('hex')}@players.example`;

export async function waitForMail(to: string, subject: RegExp, timeoutMs = 10_000): Promise<CaughtMail> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    const res = await request(baseUrl).get('/api/dev/mail').query({ to });
    const mail = (res.body.mails as CaughtMail[]).find((m) => subject.test(m.subject));
    if (mail) return mail;
    await new Promise((r) => setTimeout(r, 150));
  }
  throw new Error(`no mail "${subject}" reached ${to} within ${timeoutMs} ms`);
}

/** The path and query of the first link in a caught mail that points at our server. */
export function linkPath(mail: CaughtMail): string {
  const link = mail.links.find((l) => l.startsWith(baseUrl));
  if (!link) throw new Error(`mail "${mail.subject}" has no link to ${baseUrl}`);
  return link.slice(baseUrl.length);
}

export const PASSWORD = 'metronome-at-96';

/** Signs up, confirms through the caught mail and signs in; returns the signed-in agent. */
export async function signedInUser(label: string, role: Role = 'player') {
  const email = uniqueEmail(label);
  const a = agent();
  await a.post('/api/auth/sign-up/email').send({ name: `Test ${label}`, email, password: PASSWORD }).expect(200);
  const mail = await waitForMail(email, /confirm/i);
  await a.get(linkPath(mail)).expect(302);
  if (role !== 'player') await setRoleDirectly(email, role);
  await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
  const me = await a.get('/api/me').expect(200);
  return { agent: a, email, id: me.body.id as string };
}

/** The first admin has to come from somewhere: tests write it into the database as an operator would. */
export async function setRoleDirectly(email: string, role: Role) {
  const conn = await mariadb.createConnection({
    host: '127.0.0.1',
    port: Number(process.env.TACTUS_DB_PORT ?? 3406),
    user: process.env.TACTUS_DB_USER ?? 'tactus',
    password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
    database: 'tactus_test',
  });
  try {
    await conn.query('UPDATE users SET role = ? WHERE email = ?', [role, email]);
  } finally {
    await conn.end();
  }
}
