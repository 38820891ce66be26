// Migrations on a database of their own: links between teachers and students made before invitations existed
// (nobody asked the student) become pending invitations, and the teacher sees nothing until the student accepts.
import { execFile } from 'node:child_process';
import path from 'node:path';
import { promisify } from 'node:util';
import mariadb from 'mariadb';
import { query } from './helpers';
import { root } from '@/tests/setup/processes';

const DB = 'tactus_test_migrations';
const migrateTo = (to?: string) =>
  promisify(execFile)(
    process.execPath,
    ['--import', 'tsx', path.join(root, 'server/scripts/migrate.ts'), ...(to ? ['--to', to] : [])],
    {
      cwd: root,
      env: { ...JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!), TACTUS_DB_NAME: DB },
    },
  );

beforeAll(async () => {
  const conn = await mariadb.createConnection({
    host: '127.0.0.1',
    port: Number(process.env.TACTUS_DB_PORT ?? 3406),
    user: process.env.TACTUS_DB_USER ?? 'tactus',
    password: process.env.TACTUS_DB_PASSWORD ?? 'tactus-local',
  });
  await conn.query(`DROP DATABASE IF EXISTS ${DB}`);
  await conn.query(`CREATE DATABASE ${DB} CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await conn.end();
});

test('a link made without consent becomes a pending invitation to the student’s address', async () => {
  await migrateTo('0006-passages');
  const now = new Date();
  const user = (id: string, email: string, role: string) =>
    query(
      DB,
      'INSERT INTO users (id, name, email, emailVerified, role, createdAt, updatedAt) VALUES (?, ?, ?, 1, ?, ?, ?)',
      [id, id, email, role, now, now],
    );
  await user('teacher-1', 'marta@studio.example', 'teacher');
  await user('student-1', 'Ilya@Players.example', 'player');
  await query(
    DB,
    'INSERT INTO studio_links (id, teacherId, studentId, createdAt, updatedAt) VALUES (UUID(), ?, ?, ?, ?)',
    ['teacher-1', 'student-1', now, now],
  );

  const { stdout } = await migrateTo();
  expect(stdout).toContain('0007-studio-invitations');
  expect(await query(DB, 'SELECT * FROM studio_links')).toHaveLength(0);
  const [invitation] = await query<{ teacherId: string; email: string; status: string; expiresAt: Date }>(
    DB,
    'SELECT * FROM studio_invitations',
  );
  expect(invitation).toMatchObject({ teacherId: 'teacher-1', email: 'ilya@players.example', status: 'pending' });
  // Seven days to answer, from the migration on.
  const days = (new Date(invitation!.expiresAt).getTime() - now.getTime()) / 86_400_000;
  expect(days).toBeGreaterThan(6.9);
  expect(days).toBeLessThan(7.1);
});

test('running the migrations again changes nothing', async () => {
  const { stdout } = await migrateTo();
  expect(stdout).toContain('schema up to date');
});
