// Songs: validation with clear 400s naming the field, ownership, the teacher's view of a student, and the
// library's search, sort and filter (done by the server, on the player's own songs only).
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { baseUrl, linkStudent, signedInUser } from './helpers';
import { root } from '@/tests/setup/processes';
import { SongListItemSchema } from '@/shared/schemas';

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

describe('the library: search, sort and filter', () => {
  let player: Awaited<ReturnType<typeof signedInUser>>;
  const ids: Record<string, string> = {};
  const titles = async (query: string) =>
    ((await player.agent.get(`/api/songs${query}`).expect(200)).body.songs as { title: string }[]).map((s) => s.title);

  beforeAll(async () => {
    player = await signedInUser('library');
    // Progress is working ÷ goal: 110/100 = 1.1, 72/72 = 1, 126/152 ≈ 0.83, 88/112 ≈ 0.79; the air has no goal.
    const songs = [
      { title: 'Copperline Reel', composer: 'trad.', key: 'D major', goalBpm: 112, workingBpm: 88, chosenBpm: 104 },
      { title: 'Lanterns over Kessel Bay', composer: 'Ilya Brandt', goalBpm: 72, workingBpm: 72, chosenBpm: 70 },
      { title: 'Nine Steps Waltz', composer: 'Pieter Vahl', meter: '3/4', goalBpm: 152, workingBpm: 126 },
      { title: 'Saltmarsh Air', composer: 'Wren Adeyemi', chosenBpm: 80 },
      { title: '100% Swing_Time', goalBpm: 100, workingBpm: 110 },
    ];
    for (const song of songs) ids[song.title] = (await player.agent.post('/api/songs').send(song).expect(201)).body.id;
    // Practised: the waltz first, the reel later (a slower session leaves the working tempos as they are).
    for (const title of ['Nine Steps Waltz', 'Copperline Reel'])
      await player.agent
        .post(`/api/songs/${ids[title]}/practice`)
        .send({ startBpm: 60, reachedBpm: 70, repetitions: 3, minutes: 10, clean: true })
        .expect(201);
    await player.agent
      .post(`/api/songs/${ids['Copperline Reel']}/recordings`)
      .field('kind', 'reference')
      .attach('file', fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3')), 'reel.mp3')
      .expect(201);
    // Another player's song that every search below would match: it never appears.
    const other = await signedInUser('library-other');
    await other.agent
      .post('/api/songs')
      .send({
        title: 'Copperline Reel 100% Swing_Time Kessel Bay',
        composer: 'Pieter Vahl',
        goalBpm: 60,
        workingBpm: 60,
      })
      .expect(201);
  });

  test('sorted by title by default, with each song’s figures', async () => {
    expect(await titles('')).toEqual([
      '100% Swing_Time',
      'Copperline Reel',
      'Lanterns over Kessel Bay',
      'Nine Steps Waltz',
      'Saltmarsh Air',
    ]);
    const songs = (await player.agent.get('/api/songs').expect(200)).body.songs;
    const reel = songs.find((s: { title: string }) => s.title === 'Copperline Reel');
    expect(reel).toMatchObject({ key: 'D major', recordingCount: 1, passageCount: 0, ready: false });
    // Only what the library shows: the whole song (notes, who set a tempo, permissions) is GET /api/songs/:id.
    expect(Object.keys(reel).sort()).toEqual(Object.keys(SongListItemSchema.shape).sort());
    expect(reel).not.toHaveProperty('notes');
    expect(reel.progress).toBeCloseTo(88 / 112, 6);
    expect(Date.parse(reel.lastPractisedAt)).toBeGreaterThan(Date.now() - 10 * 60_000);
    expect(songs.find((s: { title: string }) => s.title === 'Saltmarsh Air')).toMatchObject({
      progress: null,
      lastPractisedAt: null,
      recordingCount: 0,
      ready: false,
    });
  });

  test('sorted by last practised (most recent first), chosen tempo (slowest first), progress (closest first)', async () => {
    // Songs without the value come last, by title.
    expect(await titles('?sort=lastPractised')).toEqual([
      'Copperline Reel',
      'Nine Steps Waltz',
      '100% Swing_Time',
      'Lanterns over Kessel Bay',
      'Saltmarsh Air',
    ]);
    expect(await titles('?sort=chosenBpm')).toEqual([
      'Lanterns over Kessel Bay',
      'Saltmarsh Air',
      'Copperline Reel',
      '100% Swing_Time',
      'Nine Steps Waltz',
    ]);
    expect(await titles('?sort=progress')).toEqual([
      '100% Swing_Time',
      'Lanterns over Kessel Bay',
      'Nine Steps Waltz',
      'Copperline Reel',
      'Saltmarsh Air',
    ]);
  });

  test('ready to perform means the working tempo has reached the goal; learning is the rest', async () => {
    expect(await titles('?status=ready')).toEqual(['100% Swing_Time', 'Lanterns over Kessel Bay']);
    expect(await titles('?status=learning&sort=progress')).toEqual([
      'Nine Steps Waltz',
      'Copperline Reel',
      'Saltmarsh Air',
    ]);
  });

  test('search finds words in the title or the composer, in any case; % and _ are letters, not wildcards', async () => {
    expect(await titles('?q=VAHL')).toEqual(['Nine Steps Waltz']);
    expect(await titles('?q=bay%20kessel')).toEqual(['Lanterns over Kessel Bay']);
    expect(await titles('?q=reel')).toEqual(['Copperline Reel']);
    expect(await titles('?q=%25')).toEqual(['100% Swing_Time']);
    expect(await titles('?q=_')).toEqual(['100% Swing_Time']);
    expect(await titles('?q=reel&status=ready')).toEqual([]);
    expect(await titles('?q=nothing-like-this')).toEqual([]);
  });

  test.each([
    ['?sort=tempo', 'sort', 'sort by one of: title, lastPractised, chosenBpm, progress'],
    ['?status=done', 'status', 'show learning or ready songs'],
    [`?q=${'a'.repeat(201)}`, 'q', 'use at most 200 characters'],
    ['?order=desc', '(query)', 'unexpected field: order'],
  ])('a bad query %s is refused with 400 in plain words', async (query, field, words) => {
    const res = await player.agent.get(`/api/songs${query}`);
    expect(res.status).toBe(400);
    expect(res.body.error).toMatchObject({ code: 'invalid_query', field });
    expect(res.body.error.message).toContain(words);
  });
});

describe('a song’s key', () => {
  test('is free text, trimmed, at most 40 characters, and may be cleared', async () => {
    const { agent } = await signedInUser('song-key');
    const song = (await agent.post('/api/songs').send({ title: 'Slate Roof Nocturne', key: '  B♭ minor ' }).expect(201))
      .body;
    expect(song.key).toBe('B♭ minor');
    const long = await agent.patch(`/api/songs/${song.id}`).send({ key: 'x'.repeat(41) });
    expect(long.status).toBe(400);
    expect(long.body.error).toMatchObject({ field: 'key', message: 'key: use at most 40 characters' });
    expect((await agent.patch(`/api/songs/${song.id}`).send({ key: ' ' }).expect(200)).body.key).toBeNull();
    expect((await agent.get(`/api/songs/${song.id}`).expect(200)).body.key).toBeNull();
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
