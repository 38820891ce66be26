// The practice log by hand: every field of an entry (song, optional passage, tempos, clean or not, repetitions,
// minutes, note, the day of a session logged later), refused input in plain words with nothing written, a
// passage of another song refused, another player kept out; the whole log across songs and its CSV export read back with csv-parse.
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { parse } from 'csv-parse/sync';
import { baseUrl, linkStudent, query, signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';

const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));

let owner: Awaited<ReturnType<typeof signedInUser>>;
let songId: string;
let passageId: string;
let recordingId: string;

beforeAll(async () => {
  owner = await signedInUser('practice-log');
  songId = (
    await owner.agent.post('/api/songs').send({ title: 'Saltmarsh Hornpipe', goalBpm: 112, workingBpm: 90 }).expect(201)
  ).body.id;
  recordingId = (
    await owner.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'reference')
      .attach('file', clip, 'hornpipe.mp3')
      .expect(201)
  ).body.id;
  await waitForAnalysis(owner.agent, recordingId);
  passageId = (
    await owner.agent
      .post(`/api/songs/${songId}/passages`)
      .send({ recordingId, name: 'the turn', startSec: 3.87, endSec: 7.74, startBar: 3, endBar: 4, workingBpm: 80 })
      .expect(201)
  ).body.id;
});

const countEntries = async () =>
  Number(
    (
      await query<{ n: number }>('tactus_test', 'SELECT COUNT(*) AS n FROM practice_entries WHERE songId = ?', [songId])
    )[0]!.n,
  );

test('an entry by hand keeps every field, a passage’s name and region, and its note', async () => {
  const whole = (
    await owner.agent
      .post(`/api/songs/${songId}/practice`)
      .send({ startBpm: 90, reachedBpm: 94, repetitions: 6, minutes: 12.5, clean: true, note: '  steady throughout ' })
      .expect(201)
  ).body;
  expect(whole).toMatchObject({
    passage: null,
    passageId: null,
    reachedBpm: 94,
    clean: true,
    note: 'steady throughout',
  });
  const onPassage = (
    await owner.agent
      .post(`/api/songs/${songId}/practice`)
      .send({ passageId, startBpm: 80, reachedBpm: 84, repetitions: 10, minutes: 8, clean: false, note: '' })
      .expect(201)
  ).body;
  expect(onPassage).toMatchObject({ passage: 'the turn', passageId, startBar: 3, endBar: 4, clean: false, note: null });
  // Logging changes no working tempo: the screen offers the raise and the player decides.
  expect((await owner.agent.get(`/api/songs/${songId}`).expect(200)).body.workingBpm).toBe(90);
});

test('refused input is told in plain words, naming the field, and nothing is written', async () => {
  const before = await countEntries();
  const cases: [Record<string, unknown>, string, RegExp][] = [
    [{ reachedBpm: 0 }, 'reachedBpm', /at least/],
    [{ repetitions: 0 }, 'repetitions', /must be at least 1/],
    [{ minutes: 2000 }, 'minutes', /at most a day/],
    [{ note: 'x'.repeat(1001) }, 'note', /at most 1000 characters/],
    [{ clean: 'yes' }, 'clean', /./],
  ];
  for (const [change, field, words] of cases) {
    const res = await owner.agent
      .post(`/api/songs/${songId}/practice`)
      .send({ startBpm: 90, reachedBpm: 94, repetitions: 4, minutes: 5, clean: true, ...change })
      .expect(400);
    expect(res.body.error.field).toBe(field);
    expect(res.body.error.message).toMatch(words);
    // Plain words, not a parser's dump of types and paths.
    expect(res.body.error.message).not.toMatch(/Expected|invalid_type|ZodError|\[/);
  }
  expect(await countEntries()).toBe(before);
});

test('a session logged later counts on its day: listed, exported and dated there, with when it was logged', async () => {
  const player = await signedInUser('practice-later');
  const song = (await player.agent.post('/api/songs').send({ title: 'Lantern Jig' }).expect(201)).body.id;
  const entry = { startBpm: 88, reachedBpm: 92, repetitions: 5, minutes: 20, clean: true };
  const today = (await player.agent.post(`/api/songs/${song}/practice`).send(entry).expect(201)).body;
  // Today's entry is dated when it was logged.
  expect(today.createdAt).toBe(today.loggedAt);

  // Yesterday at noon (the form sends noon of the chosen day in the player's zone), with the zone's offset.
  const yesterdayNoon = new Date(Date.now() - 86_400_000);
  yesterdayNoon.setUTCHours(12, 0, 0, 0);
  const practisedAt = yesterdayNoon.toISOString().replace('Z', '+00:00');
  const before = Date.now();
  const later = (
    await player.agent
      .post(`/api/songs/${song}/practice`)
      .send({ ...entry, reachedBpm: 90, practisedAt })
      .expect(201)
  ).body;
  expect(later.createdAt).toBe(yesterdayNoon.toISOString());
  expect(Date.parse(later.loggedAt)).toBeGreaterThanOrEqual(before - 1000);

  // The song's log and the whole log are newest played first: the later-logged session comes after today's.
  const listed = (await player.agent.get(`/api/songs/${song}/practice`).expect(200)).body.entries;
  expect(listed.map((e: { id: string }) => e.id)).toEqual([today.id, later.id]);
  const whole = (await player.agent.get('/api/practice').expect(200)).body.entries;
  expect(whole.map((e: { id: string }) => e.id)).toEqual([today.id, later.id]);
  // The export (oldest first) dates it on its day.
  const rows = parse((await player.agent.get('/api/practice/export').expect(200)).text, { columns: true }) as Record<
    string,
    string
  >[];
  expect(rows.map((r) => [r.date, r['reached BPM']])).toEqual([
    [yesterdayNoon.toISOString(), '90'],
    [today.createdAt, '92'],
  ]);
  // The library's "last practised" stays the latest session played, not the latest logged.
  const library = (await player.agent.get('/api/songs').expect(200)).body.songs as {
    id: string;
    lastPractisedAt: string;
  }[];
  expect(library.find((x) => x.id === song)!.lastPractisedAt).toBe(today.createdAt);
});

test('a day in the future, over a year back or not a date is refused in plain words, and nothing is written', async () => {
  const before = await countEntries();
  const day = 86_400_000;
  const cases: [unknown, RegExp][] = [
    [new Date(Date.now() + day).toISOString(), /^practisedAt: cannot be in the future$/],
    [new Date(Date.now() - 400 * day).toISOString(), /^practisedAt: must be within the last year$/],
    ['yesterday', /^practisedAt: give a date and time such as 2026-11-30T12:00:00Z$/],
    ['2026-11-30', /^practisedAt: give a date and time/],
    [20261130, /^practisedAt: enter some text$/],
  ];
  for (const [practisedAt, words] of cases) {
    const res = await owner.agent
      .post(`/api/songs/${songId}/practice`)
      .send({ startBpm: 90, reachedBpm: 94, repetitions: 4, minutes: 5, clean: true, practisedAt })
      .expect(400);
    expect(res.body.error).toMatchObject({
      code: 'invalid_body',
      field: 'practisedAt',
      message: expect.stringMatching(words),
    });
  }
  expect(await countEntries()).toBe(before);
  // Half a year back is within reach.
  await owner.agent
    .post(`/api/songs/${songId}/practice`)
    .send({
      startBpm: 90,
      reachedBpm: 94,
      repetitions: 4,
      minutes: 5,
      clean: true,
      practisedAt: new Date(Date.now() - 182 * day).toISOString(),
    })
    .expect(201);
  expect(await countEntries()).toBe(before + 1);
});

test('a passage or a looped recording must belong to the song; another player gets 404 and anonymous 401', async () => {
  const other = (await owner.agent.post('/api/songs').send({ title: 'Other tune' }).expect(201)).body.id;
  const res = await owner.agent
    .post(`/api/songs/${other}/practice`)
    .send({ passageId, startBpm: 80, reachedBpm: 80, repetitions: 1, minutes: 1, clean: false })
    .expect(400);
  expect(res.body.error).toMatchObject({ field: 'passageId', message: expect.stringMatching(/passage of this song/) });
  const loopElsewhere = await owner.agent
    .post(`/api/songs/${other}/practice`)
    .send({
      recordingId,
      startSec: 1,
      endSec: 3,
      startBpm: 80,
      reachedBpm: 80,
      repetitions: 1,
      minutes: 1,
      clean: false,
    })
    .expect(400);
  expect(loopElsewhere.body.error).toMatchObject({
    field: 'recordingId',
    message: expect.stringMatching(/recording of this song/),
  });

  const stranger = await signedInUser('practice-stranger');
  const entry = { startBpm: 90, reachedBpm: 94, repetitions: 4, minutes: 5, clean: true };
  await stranger.agent.get(`/api/songs/${songId}/practice`).expect(404);
  await stranger.agent.post(`/api/songs/${songId}/practice`).send(entry).expect(404);
  // The stranger's own whole log and export hold nothing of the owner's.
  expect((await stranger.agent.get('/api/practice').expect(200)).body.entries).toEqual([]);
  const csv = (await stranger.agent.get('/api/practice/export').expect(200)).text;
  expect(parse(csv, { columns: true })).toEqual([]);
  await request(baseUrl).get('/api/practice').expect(401);
  await request(baseUrl).get('/api/practice/export').expect(401);
});

test('the CSV export parses back field for field, with commas, quotes and line breaks in notes (RFC 4180 §2)', async () => {
  const player = await signedInUser('practice-csv');
  const song = (await player.agent.post('/api/songs').send({ title: 'Reel, "the quick one"' }).expect(201)).body.id;
  const notes = ['slow, then fast', 'she said "again"', 'bar 12:\nleft hand tense', 'plain'];
  for (const [i, note] of notes.entries()) {
    await player.agent
      .post(`/api/songs/${song}/practice`)
      .send({ startBpm: 90, reachedBpm: 90 + i * 2.5, repetitions: i + 1, minutes: 5.5, clean: i % 2 === 0, note })
      .expect(201);
  }
  const res = await player.agent.get('/api/practice/export').expect(200);
  expect(res.headers['content-type']).toMatch(/^text\/csv/);
  expect(res.headers['content-disposition']).toMatch(/^attachment; filename="?practice-log-\d{4}-\d{2}-\d{2}\.csv"?$/);
  // RFC 4180 §2.1: records end in CRLF. §2.6–2.7: a field with a comma, quote or line break is quoted, and a quote
  // inside is doubled.
  expect(res.text.split('\r\n')[0]).toBe(
    'date,song,passage,first bar,last bar,start BPM,reached BPM,clean,repetitions,minutes,note',
  );
  expect(res.text).toContain('"Reel, ""the quick one"""');
  expect(res.text).toContain('"bar 12:\nleft hand tense"');

  // csv-parse, a general-purpose reader, gets every field back as written.
  const rows = parse(res.text, { columns: true }) as Record<string, string>[];
  expect(rows.map((r) => r.note)).toEqual(notes); // oldest first
  expect(rows.map((r) => r['reached BPM'])).toEqual(['90', '92.5', '95', '97.5']);
  expect(rows.map((r) => r.clean)).toEqual(['yes', 'no', 'yes', 'no']);
  expect(rows.every((r) => r.song === 'Reel, "the quick one"' && r.minutes === '5.5')).toBe(true);
  // ISO 8601 dates (UTC, with milliseconds), the same instants the API lists.
  const listed = (await player.agent.get('/api/practice').expect(200)).body.entries as { createdAt: string }[];
  expect(rows.map((r) => r.date)).toEqual(listed.map((e) => e.createdAt).reverse());
  for (const r of rows) expect(r.date).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
});

test('Undo of a raise puts back the working tempo with who set it: the teacher’s name survives the round trip', async () => {
  const player = await signedInUser('practice-undo');
  const teacher = await signedInUser('practice-undo-teacher', 'teacher');
  await linkStudent(teacher, player);
  const song = (await player.agent.post('/api/songs').send({ title: 'Undo Reel', goalBpm: 112 }).expect(201)).body.id;
  await teacher.agent.patch(`/api/songs/${song}/tempos`).send({ workingBpm: 90 }).expect(200);
  const raised = (await player.agent.patch(`/api/songs/${song}/tempos`).send({ workingBpm: 96 }).expect(200)).body;
  expect(raised).toMatchObject({ workingBpm: 96, workingSetBy: { id: player.id } });
  const undone = (await player.agent.patch(`/api/songs/${song}/tempos`).send({ undoWorking: true }).expect(200)).body;
  expect(undone).toMatchObject({
    workingBpm: 90,
    workingSetBy: { id: teacher.id, name: 'Test practice-undo-teacher' },
  });
  // Nothing left to undo, said in words; an undo and a tempo at once is refused.
  const again = await player.agent.patch(`/api/songs/${song}/tempos`).send({ undoWorking: true }).expect(409);
  expect(again.body.error.message).toMatch(/no change of the working tempo to undo/);
  const both = await player.agent
    .patch(`/api/songs/${song}/tempos`)
    .send({ undoWorking: true, workingBpm: 100 })
    .expect(400);
  expect(both.body.error.field).toBe('undoWorking');
  // A passage's working tempo the same way (the passage from beforeAll has 80, set by its owner).
  await owner.agent.patch(`/api/passages/${passageId}/tempos`).send({ workingBpm: 84 }).expect(200);
  const back = (await owner.agent.patch(`/api/passages/${passageId}/tempos`).send({ undoWorking: true }).expect(200))
    .body;
  expect(back).toMatchObject({ workingBpm: 80 });
  // Another player cannot undo anything of the song: 404.
  const stranger = await signedInUser('practice-undo-stranger');
  await stranger.agent.patch(`/api/songs/${song}/tempos`).send({ undoWorking: true }).expect(404);
});
