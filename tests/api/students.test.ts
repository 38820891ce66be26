// A teacher's students list flags what waits for the teacher's answer: a recent take they have not written on,
// and an open note whose last word is the student's (a question, or a reply back). Answering, resolving, an old
// take or another teacher's word each change it as a teacher would expect; each teacher sees their own (a reply to
// the other teacher waits for that teacher; a note from before the link waits for no one).
import fs from 'node:fs';
import path from 'node:path';
import { linkStudent, query, signedInUser } from './helpers';
import { root } from '@/tests/setup/processes';
import type { Student } from '@/shared/schemas';

// 12 s of drums and bass at 124 BPM (fixtures/clips/drums-bass-124.truth.json).
const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));
type Person = Awaited<ReturnType<typeof signedInUser>>;
let teacher: Person;
let otherTeacher: Person;
let student: Person;
let songId: string;

beforeAll(async () => {
  teacher = await signedInUser('students-teacher', 'teacher');
  otherTeacher = await signedInUser('students-teacher-2', 'teacher');
  student = await signedInUser('students-student');
  await linkStudent(teacher, student);
  await linkStudent(otherTeacher, student);
  songId = (await student.agent.post('/api/songs').send({ title: 'Copperline Reel' }).expect(201)).body.id;
});

const upload = async (kind: 'take' | 'reference', name: string) =>
  (
    await student.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', kind)
      .field('label', name)
      .attach('file', clip, `${name}.mp3`)
      .expect(201)
  ).body.id as string;

/** The student as `who` sees them on the Students page. */
const seenBy = async (who: Person): Promise<Student> =>
  ((await who.agent.get('/api/students').expect(200)).body.students as Student[]).find((s) => s.id === student.id)!;

test('a new take waits for each teacher until that teacher writes on it; a reference never waits', async () => {
  await upload('reference', 'band recording');
  const take = await upload('take', 'Take 1');
  for (const who of [teacher, otherTeacher]) {
    const s = await seenBy(who);
    expect(s.awaiting).toEqual({ takes: 1, notes: 0 });
    expect(s.songs[0]!.recentTakes).toEqual([expect.objectContaining({ id: take, awaitingAnswer: true })]);
  }

  // The teacher's note answers the take for that teacher only.
  await teacher.agent.post(`/api/recordings/${take}/notes`).send({ atSec: 2, text: 'Good start.' }).expect(201);
  const answered = await seenBy(teacher);
  expect(answered.awaiting).toEqual({ takes: 0, notes: 0 });
  expect(answered.songs[0]!.recentTakes[0]!.awaitingAnswer).toBe(false);
  expect((await seenBy(otherTeacher)).awaiting).toEqual({ takes: 1, notes: 0 });

  // With the links a month old, a take of 13 days still waits and one older than two weeks no longer does (it
  // has been to a lesson or is past answering): the age rule, not the link's date, decides.
  await query('tactus_test', 'UPDATE studio_links SET createdAt = ? WHERE studentId = ?', [daysAgo(30), student.id]);
  await query('tactus_test', 'UPDATE recordings SET createdAt = ? WHERE id = ?', [daysAgo(13), take]);
  expect((await seenBy(otherTeacher)).awaiting).toEqual({ takes: 1, notes: 0 });
  await query('tactus_test', 'UPDATE recordings SET createdAt = ? WHERE id = ?', [daysAgo(15), take]);
  expect((await seenBy(otherTeacher)).awaiting).toEqual({ takes: 0, notes: 0 });
});

const daysAgo = (days: number) => new Date(Date.now() - days * 86_400_000);

test('every take the count names is on the card, beyond the three newest', async () => {
  const song = (await student.agent.post('/api/songs').send({ title: 'Nine Steps Waltz' }).expect(201)).body.id;
  const ids: string[] = [];
  for (let i = 1; i <= 4; i++)
    ids.push(
      (
        await student.agent
          .post(`/api/songs/${song}/recordings`)
          .field('kind', 'take')
          .field('label', `Waltz take ${i}`)
          .attach('file', clip, `waltz-${i}.mp3`)
          .expect(201)
      ).body.id,
    );
  const card = (await seenBy(teacher)).songs.find((x) => x.id === song)!;
  expect(
    card.recentTakes
      .filter((t) => t.awaitingAnswer)
      .map((t) => t.id)
      .sort(),
  ).toEqual([...ids].sort());
  for (const id of ids) await student.agent.delete(`/api/recordings/${id}`).expect(204);
  await student.agent.delete(`/api/songs/${song}`).expect(204);
});

test('a note whose last word is the student’s waits until a teacher answers or it is resolved', async () => {
  const take = await upload('take', 'Take 2');
  // Both teachers write on the take, so only notes are left to wait.
  for (const who of [teacher, otherTeacher])
    await who.agent.post(`/api/recordings/${take}/notes`).send({ atSec: 1, text: 'Heard it.' }).expect(201);
  expect((await seenBy(teacher)).awaiting).toEqual({ takes: 0, notes: 0 });

  // The student asks on their take: it waits, named by its recording so the teacher can open it.
  const question = (
    await student.agent
      .post(`/api/recordings/${take}/notes`)
      .send({ atSec: 6, text: 'Is the fill here too fast?' })
      .expect(201)
  ).body.id;
  const asked = await seenBy(teacher);
  expect(asked.awaiting).toEqual({ takes: 0, notes: 1 });
  expect(asked.songs[0]!.notesAwaiting).toEqual([{ recordingId: take, label: 'Take 2', notes: 1 }]);

  // A teacher answers: the last word is theirs, nothing waits.
  await teacher.agent.post(`/api/notes/${question}/replies`).send({ text: 'A little: count it in.' }).expect(201);
  expect((await seenBy(teacher)).awaiting.notes).toBe(0);
  // The student replies back: it waits again.
  await student.agent.post(`/api/notes/${question}/replies`).send({ text: 'Like this?' }).expect(201);
  expect((await seenBy(teacher)).awaiting.notes).toBe(1);
  // The teacher's own note with the student's reply under it waits too.
  const teachersNote = (await teacher.agent.get(`/api/recordings/${take}/notes`).expect(200)).body.notes.find(
    (n: { author: { id: string } }) => n.author.id === teacher.id,
  );
  await student.agent.post(`/api/notes/${teachersNote.id}/replies`).send({ text: 'Thanks!' }).expect(201);
  expect((await seenBy(teacher)).songs[0]!.notesAwaiting).toEqual([{ recordingId: take, label: 'Take 2', notes: 2 }]);

  // The student's reply to the other teacher's note waits for that teacher, not for this one.
  const othersNote = (await teacher.agent.get(`/api/recordings/${take}/notes`).expect(200)).body.notes.find(
    (n: { author: { id: string } }) => n.author.id === otherTeacher.id,
  );
  await student.agent.post(`/api/notes/${othersNote.id}/replies`).send({ text: 'Will do.' }).expect(201);
  expect((await seenBy(teacher)).awaiting.notes).toBe(2);
  expect((await seenBy(otherTeacher)).awaiting.notes).toBe(1);
  await student.agent.patch(`/api/notes/${othersNote.id}`).send({ resolved: true }).expect(200);

  // A note the student wrote before the link (their own, no teacher in it) is not this teacher's to answer.
  const before = (
    await student.agent.post(`/api/recordings/${take}/notes`).send({ atSec: 8, text: 'Breathe here.' }).expect(201)
  ).body.id;
  await query('tactus_test', 'UPDATE recording_notes SET createdAt = ? WHERE id = ?', [daysAgo(40), before]);
  expect((await seenBy(teacher)).awaiting.notes).toBe(2);
  await student.agent.patch(`/api/notes/${before}`).send({ resolved: true }).expect(200);

  // Resolved, from either side, a note no longer waits.
  await student.agent.patch(`/api/notes/${question}`).send({ resolved: true }).expect(200);
  await teacher.agent.patch(`/api/notes/${teachersNote.id}`).send({ resolved: true }).expect(200);
  const after = await seenBy(teacher);
  expect(after.awaiting.notes).toBe(0);
  expect(after.songs[0]!.notesAwaiting).toEqual([]);
});

test('a teacher the student is not linked to sees none of it', async () => {
  const stranger = await signedInUser('students-stranger', 'teacher');
  expect((await stranger.agent.get('/api/students').expect(200)).body.students).toEqual([]);
});
