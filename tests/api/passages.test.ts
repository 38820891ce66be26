// Passages: named regions of a song's recordings with their own tempos, and practice entries that point at
// the passage (recording, start and end, bars) rather than at a display string.
import fs from 'node:fs';
import path from 'node:path';
import { signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';

// 12 s of drums and bass at 124 BPM in 4/4 (fixtures/clips/drums-bass-124.truth.json): a bar lasts 1.935 s.
const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));

let owner: Awaited<ReturnType<typeof signedInUser>>;
let songId: string;
let recordingId: string;

beforeAll(async () => {
  owner = await signedInUser('passages');
  songId = (
    await owner.agent.post('/api/songs').send({ title: 'Copperline Reel', goalBpm: 132, workingBpm: 100 }).expect(201)
  ).body.id;
  recordingId = (
    await owner.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'reference')
      .attach('file', clip, 'reel.mp3')
      .expect(201)
  ).body.id;
  await waitForAnalysis(owner.agent, recordingId);
});

test('a passage is saved with its region, bars and tempos, listed with the song, renamed and retimed', async () => {
  const created = await owner.agent
    .post(`/api/songs/${songId}/passages`)
    .send({
      recordingId,
      name: 'the turn',
      startSec: 3.87,
      endSec: 7.74,
      startBar: 3,
      endBar: 4,
      workingBpm: 96,
      goalBpm: 124,
    })
    .expect(201);
  expect(created.body).toMatchObject({
    songId,
    recordingId,
    name: 'the turn',
    startBar: 3,
    endBar: 4,
    workingBpm: 96,
    goalBpm: 124,
  });
  const list = (await owner.agent.get(`/api/songs/${songId}/passages`).expect(200)).body.passages;
  expect(list.map((p: { name: string }) => p.name)).toEqual(['the turn']);
  const renamed = await owner.agent
    .patch(`/api/passages/${created.body.id}`)
    .send({ name: 'bars 3–4', workingBpm: 100 })
    .expect(200);
  expect(renamed.body).toMatchObject({ name: 'bars 3–4', workingBpm: 100, startSec: 3.87 });
  await owner.agent.delete(`/api/passages/${created.body.id}`).expect(204);
  expect((await owner.agent.get(`/api/songs/${songId}/passages`).expect(200)).body.passages).toEqual([]);
});

test('a region that is backwards, past the end, or on another song’s recording is refused naming the field', async () => {
  const post = (body: object) =>
    owner.agent.post(`/api/songs/${songId}/passages`).send({ recordingId, name: 'x', startSec: 1, endSec: 2, ...body });
  expect((await post({ startSec: 5, endSec: 4 }).expect(400)).body.error.field).toBe('endSec');
  expect((await post({ endSec: 600 }).expect(400)).body.error.field).toBe('endSec');
  expect((await post({ startBar: 4, endBar: 2 }).expect(400)).body.error.field).toBe('endBar');
  expect((await post({ name: '   ' }).expect(400)).body.error.field).toBe('name');
  const other = (await owner.agent.post('/api/songs').send({ title: 'Another' }).expect(201)).body.id;
  const wrong = await owner.agent
    .post(`/api/songs/${other}/passages`)
    .send({ recordingId, name: 'x', startSec: 1, endSec: 2 })
    .expect(400);
  expect(wrong.body.error.field).toBe('recordingId');
});

test('a practice entry on a passage keeps its region; logging it changes neither working tempo (the app offers the raise)', async () => {
  const passage = (
    await owner.agent
      .post(`/api/songs/${songId}/passages`)
      .send({ recordingId, name: 'bridge', startSec: 5.8, endSec: 9.68, startBar: 4, endBar: 5, workingBpm: 90 })
      .expect(201)
  ).body;
  const entry = (
    await owner.agent
      .post(`/api/songs/${songId}/practice`)
      .send({ passageId: passage.id, startBpm: 90, reachedBpm: 98, repetitions: 6, minutes: 12, clean: true })
      .expect(201)
  ).body;
  expect(entry).toMatchObject({
    passage: 'bridge',
    passageId: passage.id,
    recordingId,
    startSec: 5.8,
    endSec: 9.68,
    startBar: 4,
    endBar: 5,
  });
  expect((await owner.agent.get(`/api/songs/${songId}/passages`).expect(200)).body.passages[0].workingBpm).toBe(90);
  expect((await owner.agent.get(`/api/songs/${songId}`).expect(200)).body.workingBpm).toBe(100);

  // Deleting the passage keeps the entry and what was played.
  await owner.agent.delete(`/api/passages/${passage.id}`).expect(204);
  const [kept] = (await owner.agent.get(`/api/songs/${songId}/practice`).expect(200)).body.entries;
  expect(kept).toMatchObject({ passage: 'bridge', passageId: null, recordingId, startSec: 5.8, endBar: 5 });
});

test('a loop that is not saved is logged with its recording and region', async () => {
  const entry = (
    await owner.agent
      .post(`/api/songs/${songId}/practice`)
      .send({
        passage: 'bars 2–3',
        recordingId,
        startSec: 1.94,
        endSec: 5.81,
        startBar: 2,
        endBar: 3,
        startBpm: 100,
        reachedBpm: 110,
        repetitions: 8,
        minutes: 9,
        clean: true,
      })
      .expect(201)
  ).body;
  expect(entry).toMatchObject({ passage: 'bars 2–3', passageId: null, recordingId, startBar: 2, endBar: 3 });
  const bad = await owner.agent
    .post(`/api/songs/${songId}/practice`)
    .send({ recordingId, startSec: 3, startBpm: 100, reachedBpm: 110, repetitions: 1, minutes: 1, clean: false })
    .expect(400);
  expect(bad.body.error.field).toBe('endSec');
});

test('another player cannot see, change or practise on the passages', async () => {
  const stranger = await signedInUser('passages-stranger');
  const passage = (
    await owner.agent
      .post(`/api/songs/${songId}/passages`)
      .send({ recordingId, name: 'intro', startSec: 0, endSec: 1.9 })
      .expect(201)
  ).body;
  await stranger.agent.get(`/api/songs/${songId}/passages`).expect(404);
  await stranger.agent.patch(`/api/passages/${passage.id}`).send({ name: 'mine' }).expect(404);
  await stranger.agent.delete(`/api/passages/${passage.id}`).expect(404);
  const ownSong = (await stranger.agent.post('/api/songs').send({ title: 'Elsewhere' }).expect(201)).body.id;
  const res = await stranger.agent
    .post(`/api/songs/${ownSong}/practice`)
    .send({ passageId: passage.id, startBpm: 80, reachedBpm: 80, repetitions: 1, minutes: 1, clean: false })
    .expect(400);
  expect(res.body.error.field).toBe('passageId');
});

test('deleting the song removes its passages with it', async () => {
  const song = (await owner.agent.post('/api/songs').send({ title: 'Short-lived' }).expect(201)).body.id;
  const rec = (
    await owner.agent
      .post(`/api/songs/${song}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'take.mp3')
      .expect(201)
  ).body.id;
  const passage = (
    await owner.agent
      .post(`/api/songs/${song}/passages`)
      .send({ recordingId: rec, name: 'all of it', startSec: 0, endSec: 10 })
      .expect(201)
  ).body;
  await waitForAnalysis(owner.agent, rec);
  await owner.agent.delete(`/api/songs/${song}`).expect(204);
  await owner.agent.patch(`/api/passages/${passage.id}`).send({ name: 'still here?' }).expect(404);
});
