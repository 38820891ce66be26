// Roles are enforced on the server: anonymous → 401, wrong role → 403, admin changes roles.
import request from 'supertest';
import { baseUrl, signedInUser } from './helpers';

describe('roles', () => {
  test('anonymous requests to any protected route get 401', async () => {
    for (const path of ['/api/me', '/api/songs', '/api/students', '/api/admin/users']) {
      const res = await request(baseUrl).get(path);
      expect(res.status).toBe(401);
      expect(res.body.error.code).toBe('unauthenticated');
    }
  });

  test('a player is refused the admin and teacher routes with 403', async () => {
    const { agent } = await signedInUser('player403');
    const admin = await agent.get('/api/admin/users');
    expect(admin.status).toBe(403);
    expect(admin.body.error.code).toBe('forbidden');
    await agent.get('/api/students').expect(403);
    await agent.patch('/api/admin/users/anyone/role').send({ role: 'admin' }).expect(403);
  });

  test('an admin makes a player a teacher, and the new role takes effect at once', async () => {
    const admin = await signedInUser('admin', 'admin');
    const player = await signedInUser('soon-teacher');
    await player.agent.get('/api/students').expect(403);

    const list = await admin.agent.get('/api/admin/users').expect(200);
    expect(list.body.users.map((u: { email: string }) => u.email)).toContain(player.email);

    const changed = await admin.agent.patch(`/api/admin/users/${player.id}/role`).send({ role: 'teacher' }).expect(200);
    expect(changed.body.role).toBe('teacher');
    await player.agent.get('/api/students').expect(200);
    expect((await player.agent.get('/api/me')).body.role).toBe('teacher');
  });

  test('a role sent at sign-up is not taken', async () => {
    const res = await request(baseUrl)
      .post('/api/auth/sign-up/email')
      .set('Origin', baseUrl)
      .send({
        name: 'Sneaky',
        email: `sneaky-${Date.now()}@players.example`,
        password: 'metronome-at-96',
        role: 'admin',
      });
    // The role field is input: false in server/auth.ts: better-auth drops it and the default applies.
    expect(res.status).toBe(200);
    expect(res.body.user.role).toBe('player');
  });
});
