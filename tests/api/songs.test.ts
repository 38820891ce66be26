// Songs: validation with clear 400s naming the field, ownership, and the teacher's view of a student.
import request from 'supertest';
import { baseUrl, linkStudent, signedInUser } from './helpers';

describe('songs', () => {
  test('a player creates, lists, changes and deletes a song', async () => {
    const { agent } = await signedInUser('songs');
    expect((await agent.get('/api/songs').expect(200)).body.songs).toEqual([]);

    const created = await agent
      .post('/api/songs')
      .send({ title: 'Drift Ice Hornpipe', composer: 'Test Composer', meter: '4/4', goalBpm: 120, workingBpm: 92.5 })
      .expect(201);
    expect(created.body).toMatchObject({
      title: 'Drift Ice Hornpipe',
      goalBpm: 120,
      workingBpm: 92.5,
      chosenBpm: null,
      meter: '4/4',
    });

    const patched = await agent.patch(`/api/songs/${created.body.id}`).send({ workingBpm: 96 }).expect(200);
    expect(patched.body.workingBpm).toBe(96);
    expect((await agent.get('/api/songs')).body.songs).toHaveLength(1);

    await agent.delete(`/api/songs/${created.body.id}`).expect(204);
    await agent.get(`/api/songs/${created.body.id}`).expect(404);
  });

  test.each([
    [{}, 'title'],
    [{ title: '   ' }, 'title'],
    [{ title: 'Fast one', goalBpm: 500 }, 'goalBpm'],
    [{ title: 'Slow one', workingBpm: 5 }, 'workingBpm'],
    [{ title: 'Odd meter', meter: 'four' }, 'meter'],
    [{ title: 'Typed wrong', goalBpm: '120' }, 'goalBpm'],
  ])('a bad body %j is refused with 400 naming %s', async (body, field) => {
    const { agent } = await signedInUser('badbody');
    const res = await agent.post('/api/songs').send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_body');
    expect(res.body.error.field).toBe(field);
    expect(res.body.error.message).toContain(field);
  });

  test('a body that is not JSON is refused with 400', async () => {
    const { agent } = await signedInUser('badjson');
    const res = await agent.post('/api/songs').set('content-type', 'application/json').send('{"title": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  test('a bad role in a role change is refused with 400 naming the field', async () => {
    const admin = await signedInUser('badrole', 'admin');
    const res = await admin.agent.patch(`/api/admin/users/${admin.id}/role`).send({ role: 'conductor' });
    expect(res.status).toBe(400);
    expect(res.body.error.field).toBe('role');
  });

  test("another player cannot see or change someone's song; their linked teacher can read it", async () => {
    const owner = await signedInUser('owner');
    const stranger = await signedInUser('stranger');
    const teacher = await signedInUser('teacher', 'teacher');
    const song = (await owner.agent.post('/api/songs').send({ title: 'Private Etude' }).expect(201)).body;

    await stranger.agent.get(`/api/songs/${song.id}`).expect(404);
    await stranger.agent.patch(`/api/songs/${song.id}`).send({ title: 'Mine now' }).expect(404);
    await stranger.agent.delete(`/api/songs/${song.id}`).expect(404);
    await teacher.agent.get(`/api/songs/${song.id}`).expect(404);

    await linkStudent(teacher, owner);
    const students = (await teacher.agent.get('/api/students').expect(200)).body.students;
    expect(students).toEqual([expect.objectContaining({ email: owner.email, songCount: 1 })]);
    expect((await teacher.agent.get(`/api/songs/${song.id}`).expect(200)).body.title).toBe('Private Etude');
    // Reading is not owning.
    await teacher.agent.patch(`/api/songs/${song.id}`).send({ title: 'Changed' }).expect(404);
  });
});

describe('health', () => {
  test('reports the database state', async () => {
    const res = await request(baseUrl).get('/api/health').expect(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up', version: expect.any(String) });
  });

  test('unknown API routes answer 404 in JSON', async () => {
    const res = await request(baseUrl).get('/api/nowhere');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});
