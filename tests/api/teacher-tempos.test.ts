// What a linked teacher may change on a student's song: the working and goal tempo (the student sees who set
// them and when) and a reference recording added to the song (its uploader shown). Everything else stays the
// student's; the answers say what each side may do, so the screens show only that.
import fs from 'node:fs';
import path from 'node:path';
import { linkStudent, signedInUser, smallUpload, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';

const clip = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));
type Person = Awaited<ReturnType<typeof signedInUser>>;
let teacher: Person;
let student: Person;
let songId: string;

beforeAll(async () => {
  teacher = await signedInUser('tt-teacher', 'teacher');
  student = await signedInUser('tt-student');
  await linkStudent(teacher, student);
  songId = (
    await student.agent
      .post('/api/songs')
      .send({ title: 'Nine Steps Waltz', meter: '3/4', goalBpm: 150, workingBpm: 110 })
      .expect(201)
  ).body.id;
});

test('the teacher sets working and goal tempo; the student sees who set them and when', async () => {
  const before = (await student.agent.get(`/api/songs/${songId}`).expect(200)).body;
  expect(before.workingSetBy).toMatchObject({ id: student.id });
  const set = await teacher.agent
    .patch(`/api/songs/${songId}/tempos`)
    .send({ workingBpm: 118, goalBpm: 156 })
    .expect(200);
  expect(set.body).toMatchObject({
    workingBpm: 118,
    goalBpm: 156,
    workingSetBy: { id: teacher.id, name: 'Test tt-teacher' },
    goalSetBy: { id: teacher.id },
  });
  const seen = (await student.agent.get(`/api/songs/${songId}`).expect(200)).body;
  expect(seen.workingSetBy.name).toBe('Test tt-teacher');
  expect(Date.parse(seen.workingSetAt)).toBeGreaterThanOrEqual(Date.parse(before.createdAt));
  // The student can set their own again, and then it is theirs.
  const own = await student.agent.patch(`/api/songs/${songId}/tempos`).send({ workingBpm: 120 }).expect(200);
  expect(own.body).toMatchObject({ workingBpm: 120, workingSetBy: { id: student.id }, goalSetBy: { id: teacher.id } });
});

test('the answers carry what each side may do', async () => {
  const asStudent = (await student.agent.get(`/api/songs/${songId}`).expect(200)).body.permissions;
  const asTeacher = (await teacher.agent.get(`/api/songs/${songId}`).expect(200)).body.permissions;
  expect(asStudent).toEqual({ edit: true, setTempos: true, addReference: true, addTake: true });
  expect(asTeacher).toEqual({ edit: false, setTempos: true, addReference: true, addTake: false });
});

test('the teacher adds a reference to the student’s song: it is the student’s, the teacher shown as uploader', async () => {
  const res = await teacher.agent
    .post(`/api/songs/${songId}/recordings`)
    .field('kind', 'reference')
    .field('label', 'How I play it')
    .attach('file', clip, 'ref.mp3')
    .expect(201);
  expect(res.body).toMatchObject({
    ownerId: student.id,
    kind: 'reference',
    uploadedBy: { id: teacher.id, name: 'Test tt-teacher' },
  });
  expect(res.body.permissions).toEqual({ edit: false, note: true });
  const mine = (await student.agent.get(`/api/recordings/${res.body.id}`).expect(200)).body;
  expect(mine.permissions).toEqual({ edit: true, note: true });
  await waitForAnalysis(student.agent, res.body.id);
  // A take is the student's own: the teacher may not upload one, nor rename or delete the reference.
  const take = await teacher.agent
    .post(`/api/songs/${songId}/recordings`)
    .field('kind', 'take')
    .attach('file', smallUpload, 'take.wav')
    .expect(403);
  expect(take.body.error.field).toBe('kind');
  await teacher.agent.patch(`/api/recordings/${res.body.id}`).send({ label: 'mine' }).expect(404);
  await teacher.agent.delete(`/api/recordings/${res.body.id}`).expect(404);
});

test('a teacher who is not linked sets nothing and uploads nothing; the student’s other fields stay theirs', async () => {
  const stranger = await signedInUser('tt-stranger', 'teacher');
  await stranger.agent.patch(`/api/songs/${songId}/tempos`).send({ workingBpm: 60 }).expect(404);
  await stranger.agent
    .post(`/api/songs/${songId}/recordings`)
    .field('kind', 'reference')
    .attach('file', smallUpload, 'x.wav')
    .expect(404);
  await teacher.agent.patch(`/api/songs/${songId}`).send({ title: 'Renamed by the teacher' }).expect(404);
  await teacher.agent.post(`/api/songs/${songId}/choose`).send({ bpm: 140 }).expect(404);
  const song = (await student.agent.get(`/api/songs/${songId}`).expect(200)).body;
  expect(song).toMatchObject({ title: 'Nine Steps Waltz', workingBpm: 120 });
});

test('the teacher sets a passage’s tempos too', async () => {
  const rec = (
    await student.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 't.mp3')
      .expect(201)
  ).body.id;
  const passage = (
    await student.agent
      .post(`/api/songs/${songId}/passages`)
      .send({ recordingId: rec, name: 'the turn', startSec: 1, endSec: 3 })
      .expect(201)
  ).body;
  const set = await teacher.agent
    .patch(`/api/passages/${passage.id}/tempos`)
    .send({ workingBpm: 100, goalBpm: 150 })
    .expect(200);
  expect(set.body).toMatchObject({ workingBpm: 100, goalBpm: 150, workingSetBy: { id: teacher.id } });
  await teacher.agent.patch(`/api/passages/${passage.id}`).send({ name: 'renamed' }).expect(404);
});
