// Set lists: songs in playing order with their click tempos, each song's length at its chosen tempo (or, none
// chosen, at its analysed one) from a recording's measured beats, and the total (a beat at B BPM lasts 60 / B s).
import fs from 'node:fs';
import path from 'node:path';
import { signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';

let player: Awaited<ReturnType<typeof signedInUser>>;
const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));
const song = async (title: string, chosenBpm?: number) =>
  (await player.agent.post('/api/songs').send({ title, chosenBpm }).expect(201)).body.id as string;

beforeAll(async () => {
  player = await signedInUser('setlists');
});

test('a set list keeps its order, shows each song’s click tempo and length, and adds them up', async () => {
  const reel = await song('Copperline Reel', 124);
  const air = await song('Saltmarsh Air', 80);
  const noTempo = await song('New one');
  const rec = (
    await player.agent
      .post(`/api/songs/${reel}/recordings`)
      .field('kind', 'reference')
      .attach('file', clip, 'r.mp3')
      .expect(201)
  ).body.id;
  const beats = (await waitForAnalysis(player.agent, rec)).analysis.beatCount as number;

  const list = (
    await player.agent
      .post('/api/set-lists')
      .send({ name: 'Harbour Lane, Friday', songIds: [air, reel, noTempo] })
      .expect(201)
  ).body;
  expect(list.songs.map((s: { title: string }) => s.title)).toEqual(['Saltmarsh Air', 'Copperline Reel', 'New one']);
  expect(list.songs.map((s: { chosenBpm: number | null }) => s.chosenBpm)).toEqual([80, 124, null]);
  // Only the reel has both a chosen tempo and measured beats: beats × 60 ÷ 124.
  expect(list.songs[1].durationSec).toBeCloseTo((beats * 60) / 124, 6);
  expect(list.songs[1].durationAt).toBe('chosen');
  expect(list.estimatedDurations).toBe(0);
  expect(list.totalSec).toBeCloseTo((beats * 60) / 124, 6);
  expect(list.unknownDurations).toBe(2);

  const reordered = (
    await player.agent
      .patch(`/api/set-lists/${list.id}`)
      .send({ songIds: [reel, air] })
      .expect(200)
  ).body;
  expect(reordered.songs.map((s: { songId: string }) => s.songId)).toEqual([reel, air]);
  expect((await player.agent.get('/api/set-lists').expect(200)).body.setLists[0].id).toBe(list.id);
});

test('a song with no chosen tempo shows its analysed tempo, as the player hears it, and the total says it is an estimate', async () => {
  const reel = await song('Gull Rock Hornpipe');
  const rec = (
    await player.agent
      .post(`/api/songs/${reel}/recordings`)
      .field('kind', 'reference')
      .attach('file', clip, 'g.mp3')
      .expect(201)
  ).body.id;
  const { analysis } = await waitForAnalysis(player.agent, rec);
  const { bpm, beatCount: beats } = analysis as { bpm: number; beatCount: number };
  const chosen = await song('Ferry Bell Polka', 116);
  const list = (
    await player.agent
      .post('/api/set-lists')
      .send({ name: 'Quay Steps, Saturday', songIds: [reel, chosen] })
      .expect(201)
  ).body;
  // No tempo chosen: its length is the recording's own, its beats at the tempo they were measured at.
  expect(list.songs[0]).toMatchObject({ chosenBpm: null, analysedBpm: bpm, durationAt: 'analysed' });
  expect(list.songs[0].durationSec).toBeCloseTo((beats * 60) / bpm, 6);
  expect(list.songs[1]).toMatchObject({ chosenBpm: 116, analysedBpm: null, durationSec: null, durationAt: null });
  expect(list).toMatchObject({ unknownDurations: 1, estimatedDurations: 1 });
  expect(list.totalSec).toBeCloseTo((beats * 60) / bpm, 6);

  // The player hears it in half time: the tempo shown halves, half as many beats are felt, the length stands.
  await player.agent.patch(`/api/recordings/${rec}`).send({ beatLevel: 'half' }).expect(200);
  const half = (await player.agent.get(`/api/set-lists/${list.id}`).expect(200)).body.songs[0];
  expect(half.analysedBpm).toBeCloseTo(bpm / 2, 6);
  expect(half.durationSec).toBeCloseTo((beats * 60) / bpm, 6);
  // A tempo the player corrected by hand is the one shown; the recording still lasts as long as it does (its
  // beats are counted at the corrected tempo: beats × 120 / found).
  await player.agent.patch(`/api/recordings/${rec}`).send({ beatLevel: 'as-found', correctedBpm: 120 }).expect(200);
  const corrected = (await player.agent.get(`/api/set-lists/${list.id}`).expect(200)).body.songs[0];
  expect(corrected.analysedBpm).toBe(120);
  expect(corrected.durationSec).toBeCloseTo((beats * 60) / bpm, 6);
  const correctedBeats = (beats * 120) / bpm;

  // Once a tempo is chosen the song counts at it, and the total is no longer an estimate.
  await player.agent.post(`/api/songs/${reel}/choose`).send({ bpm: 100 }).expect(200);
  const after = (await player.agent.get(`/api/set-lists/${list.id}`).expect(200)).body;
  expect(after.songs[0]).toMatchObject({ chosenBpm: 100, durationAt: 'chosen' });
  expect(after.songs[0].durationSec).toBeCloseTo((correctedBeats * 60) / 100, 6);
  expect(after.estimatedDurations).toBe(0);
  // The chosen tempo counts the beats the player feels: heard in half time, half as many beats at 100 BPM.
  await player.agent.patch(`/api/recordings/${rec}`).send({ beatLevel: 'half' }).expect(200);
  const halfTime = (await player.agent.get(`/api/set-lists/${list.id}`).expect(200)).body.songs[0];
  expect(halfTime.durationSec).toBeCloseTo((correctedBeats * 0.5 * 60) / 100, 6);
});

test('only one’s own songs, each once; another player sees nothing', async () => {
  const mine = await song('Mine');
  const other = await signedInUser('setlists-other');
  const theirs = (await other.agent.post('/api/songs').send({ title: 'Theirs' }).expect(201)).body.id;
  expect(
    (
      await player.agent
        .post('/api/set-lists')
        .send({ name: 'x', songIds: [mine, theirs] })
        .expect(400)
    ).body.error.field,
  ).toBe('songIds');
  expect(
    (
      await player.agent
        .post('/api/set-lists')
        .send({ name: 'x', songIds: [mine, mine] })
        .expect(400)
    ).body.error.field,
  ).toBe('songIds');
  const list = (
    await player.agent
      .post('/api/set-lists')
      .send({ name: 'Solo', songIds: [mine] })
      .expect(201)
  ).body;
  await other.agent.get(`/api/set-lists/${list.id}`).expect(404);
  await other.agent.patch(`/api/set-lists/${list.id}`).send({ name: 'mine now' }).expect(404);
  await other.agent.delete(`/api/set-lists/${list.id}`).expect(404);
  await player.agent.delete(`/api/set-lists/${list.id}`).expect(204);
});
