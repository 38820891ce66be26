// Notes on a student's take: at a moment or on a passage (bars), replies from either side, resolved or open;
// only the author changes or deletes their words; the student hears about new notes in one digest mail.
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { baseUrl, linkStudent, signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';
import type { CaughtMail } from '@/shared/schemas';

// 12 s of drums and bass at 124 BPM in 4/4 (fixtures/clips/drums-bass-124.truth.json).
const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));
type Person = Awaited<ReturnType<typeof signedInUser>>;
let teacher: Person;
let student: Person;
let recordingId: string;

beforeAll(async () => {
  teacher = await signedInUser('notes-teacher', 'teacher');
  student = await signedInUser('notes-student');
  await linkStudent(teacher, student);
  const song = (await student.agent.post('/api/songs').send({ title: 'Copperline Reel' }).expect(201)).body;
  recordingId = (
    await student.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'take.mp3')
      .expect(201)
  ).body.id;
  await waitForAnalysis(student.agent, recordingId);
});

const notesOf = async (who: Person) =>
  (await who.agent.get(`/api/recordings/${recordingId}/notes`).expect(200)).body.notes;

test('a teacher writes a note at a moment and one on a passage; both sides see them in time order; replies thread', async () => {
  const later = await teacher.agent
    .post(`/api/recordings/${recordingId}/notes`)
    .send({ text: 'rushing into the fill', startSec: 5.8, endSec: 9.7, startBar: 4, endBar: 5 })
    .expect(201);
  const moment = await teacher.agent
    .post(`/api/recordings/${recordingId}/notes`)
    .send({ text: 'lovely entry', atSec: 1.2 })
    .expect(201);
  expect(moment.body).toMatchObject({
    text: 'lovely entry',
    atSec: 1.2,
    mine: true,
    resolved: false,
    author: { id: teacher.id },
  });
  const seen = await notesOf(student);
  expect(seen.map((n: { id: string }) => n.id)).toEqual([moment.body.id, later.body.id]);
  expect(seen[1]).toMatchObject({ startBar: 4, endBar: 5, mine: false });

  await student.agent.post(`/api/notes/${later.body.id}/replies`).send({ text: 'slower there tomorrow' }).expect(201);
  await teacher.agent.post(`/api/notes/${later.body.id}/replies`).send({ text: 'try 96 first' }).expect(201);
  const thread = (await notesOf(teacher)).find((n: { id: string }) => n.id === later.body.id);
  expect(thread.replies.map((r: { text: string }) => r.text)).toEqual(['slower there tomorrow', 'try 96 first']);
});

test('either side resolves and reopens; only the author edits or deletes', async () => {
  const note = (
    await teacher.agent
      .post(`/api/recordings/${recordingId}/notes`)
      .send({ text: 'breathe before bar 3', atSec: 3.5 })
      .expect(201)
  ).body;
  expect((await student.agent.patch(`/api/notes/${note.id}`).send({ resolved: true }).expect(200)).body.resolved).toBe(
    true,
  );
  expect((await teacher.agent.patch(`/api/notes/${note.id}`).send({ resolved: false }).expect(200)).body.resolved).toBe(
    false,
  );
  const refused = await student.agent
    .patch(`/api/notes/${note.id}`)
    .send({ text: 'changed by the student' })
    .expect(403);
  expect(refused.body.error.code).toBe('not_author');
  await student.agent.delete(`/api/notes/${note.id}`).expect(403);
  await teacher.agent.patch(`/api/notes/${note.id}`).send({ text: 'breathe before bar 3, really' }).expect(200);
  await teacher.agent.delete(`/api/notes/${note.id}`).expect(204);
  expect((await notesOf(student)).map((n: { id: string }) => n.id)).not.toContain(note.id);
});

test('a note is at a moment or on a passage, within the recording; others see nothing and write nothing', async () => {
  const post = (body: object) =>
    teacher.agent.post(`/api/recordings/${recordingId}/notes`).send({ text: 'x', ...body });
  expect((await post({}).expect(400)).body.error.field).toBe('atSec');
  expect((await post({ atSec: 1, startSec: 1, endSec: 2 }).expect(400)).body.error.field).toBe('atSec');
  expect((await post({ atSec: 900 }).expect(400)).body.error.field).toBe('atSec');
  expect((await post({ startSec: 4, endSec: 3 }).expect(400)).body.error.field).toBe('endSec');
  expect((await post({ atSec: 1, text: '   ' }).expect(400)).body.error.field).toBe('text');
  const stranger = await signedInUser('notes-stranger', 'teacher');
  await stranger.agent.get(`/api/recordings/${recordingId}/notes`).expect(404);
  await stranger.agent.post(`/api/recordings/${recordingId}/notes`).send({ text: 'hello', atSec: 1 }).expect(404);
  await request(baseUrl).get(`/api/recordings/${recordingId}/notes`).expect(401);
});

test('when the link ends the teacher loses the notes at once', async () => {
  const other = await signedInUser('notes-leaver');
  await linkStudent(teacher, other);
  const song = (await other.agent.post('/api/songs').send({ title: 'Brief' }).expect(201)).body;
  const rec = (
    await other.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'b.mp3')
      .expect(201)
  ).body.id;
  await teacher.agent.post(`/api/recordings/${rec}/notes`).send({ text: 'good start', atSec: 0.5 }).expect(201);
  await other.agent.delete(`/api/teachers/${teacher.id}`).expect(204);
  await teacher.agent.get(`/api/recordings/${rec}/notes`).expect(404);
});

test('the student gets one digest mail for three new notes, with a link to the recording', async () => {
  const pupil = await signedInUser('notes-digest');
  await linkStudent(teacher, pupil);
  const song = (await pupil.agent.post('/api/songs').send({ title: 'Nine Steps Waltz' }).expect(201)).body;
  const rec = (
    await pupil.agent
      .post(`/api/songs/${song.id}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'w.mp3')
      .expect(201)
  ).body.id;
  for (const [text, atSec] of [
    ['first', 0.5],
    ['second', 2],
    ['third', 4],
  ] as const) {
    await teacher.agent.post(`/api/recordings/${rec}/notes`).send({ text, atSec }).expect(201);
  }
  // A note by the student on their own take is not mailed to them.
  await pupil.agent.post(`/api/recordings/${rec}/notes`).send({ text: 'my own', atSec: 6 }).expect(201);
  const digests = async () =>
    ((await request(baseUrl).get('/api/dev/mail').query({ to: pupil.email })).body.mails as CaughtMail[]).filter((m) =>
      /new note/.test(m.subject),
    );
  const until = Date.now() + 15_000;
  while ((await digests()).length === 0 && Date.now() < until) await new Promise((r) => setTimeout(r, 250));
  const [mail, ...more] = await digests();
  expect(more).toEqual([]);
  expect(mail!.subject).toBe('3 new notes on your recordings');
  for (const text of ['first', 'second', 'third']) expect(mail!.text).toContain(`“${text}”`);
  expect(mail!.text).not.toContain('my own');
  expect(mail!.links.some((l) => l.endsWith(`/recordings/${rec}`))).toBe(true);

  // Another note within 15 minutes waits for the next digest; turning digests off is honoured.
  await teacher.agent.post(`/api/recordings/${rec}/notes`).send({ text: 'fourth', atSec: 5 }).expect(201);
  await new Promise((r) => setTimeout(r, 3000));
  expect(await digests()).toHaveLength(1);
  expect((await pupil.agent.patch('/api/me/preferences').send({ noteDigests: false }).expect(200)).body).toEqual({
    noteDigests: false,
    stretchMethod: 'phase-vocoder',
  });
});
