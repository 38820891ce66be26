// Rubato and ritardando marks on a take: the owner marks and removes them, their linked teacher reads them, no
// one else sees them; bad input is refused in plain words and writes nothing; they go with their recording.
import fs from 'node:fs';
import path from 'node:path';
import { linkStudent, signedInUser, waitForAnalysis } from './helpers';
import { root } from '@/tests/setup/processes';

// 12 s of drums and bass at 124 BPM in 4/4 (fixtures/clips/drums-bass-124.truth.json).
const clip = fs.readFileSync(path.join(root, 'fixtures/clips/drums-bass-124.mp3'));
type Person = Awaited<ReturnType<typeof signedInUser>>;
let teacher: Person;
let student: Person;
let stranger: Person;
let songId: string;
let recordingId: string;

const upload = async () => {
  const id = (
    await student.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'take.mp3')
      .expect(201)
  ).body.id;
  await waitForAnalysis(student.agent, id);
  return id as string;
};

beforeAll(async () => {
  teacher = await signedInUser('marks-teacher', 'teacher');
  student = await signedInUser('marks-student');
  stranger = await signedInUser('marks-stranger');
  await linkStudent(teacher, student);
  songId = (await student.agent.post('/api/songs').send({ title: 'Harbour Lights Waltz' }).expect(201)).body.id;
  recordingId = await upload();
});

const marksOf = async (who: Person, id = recordingId) =>
  (await who.agent.get(`/api/recordings/${id}/tempo-marks`).expect(200)).body.marks;

test('the owner marks a ritardando and a rubato; both read back in time order, the teacher sees them too', async () => {
  const late = await student.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'ritardando', startSec: 9.5, endSec: 11.6 })
    .expect(201);
  expect(late.body).toMatchObject({ recordingId, kind: 'ritardando', startSec: 9.5, endSec: 11.6 });
  await student.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'rubato', startSec: 1.9, endSec: 3.9 })
    .expect(201);
  const mine = await marksOf(student);
  expect(mine.map((m: { kind: string }) => m.kind)).toEqual(['rubato', 'ritardando']);
  expect(await marksOf(teacher)).toEqual(mine);
});

test('a teacher may not mark or remove, another player sees nothing: 404 either way', async () => {
  const [first] = await marksOf(student);
  await teacher.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'rubato', startSec: 4, endSec: 5 })
    .expect(404);
  await teacher.agent.delete(`/api/tempo-marks/${first.id}`).expect(404);
  await stranger.agent.get(`/api/recordings/${recordingId}/tempo-marks`).expect(404);
  await stranger.agent.delete(`/api/tempo-marks/${first.id}`).expect(404);
  expect(await marksOf(student)).toHaveLength(2);
});

test('bad marks are refused in plain words, naming the field, and nothing is written', async () => {
  const before = (await marksOf(student)).length;
  const backwards = await student.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'rubato', startSec: 5, endSec: 4 })
    .expect(400);
  expect(backwards.body.error).toMatchObject({ field: 'endSec' });
  expect(backwards.body.error.message).toMatch(/end after it starts/);
  const kind = await student.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'accelerando', startSec: 1, endSec: 2 })
    .expect(400);
  expect(kind.body.error).toMatchObject({ field: 'kind' });
  expect(kind.body.error.message).toMatch(/rubato or ritardando/);
  const past = await student.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'rubato', startSec: 10, endSec: 60 })
    .expect(400);
  expect(past.body.error).toMatchObject({ field: 'endSec' });
  await student.agent
    .post(`/api/recordings/${recordingId}/tempo-marks`)
    .send({ kind: 'rubato', startSec: 1, endSec: 2, extra: true })
    .expect(400);
  expect(await marksOf(student)).toHaveLength(before);
});

test('the owner removes a mark; a recording deleted takes its marks with it', async () => {
  const [first] = await marksOf(student);
  await student.agent.delete(`/api/tempo-marks/${first.id}`).expect(204);
  await student.agent.delete(`/api/tempo-marks/${first.id}`).expect(404);
  expect((await marksOf(student)).map((m: { id: string }) => m.id)).not.toContain(first.id);

  const other = await upload();
  const mark = (
    await student.agent
      .post(`/api/recordings/${other}/tempo-marks`)
      .send({ kind: 'rubato', startSec: 1, endSec: 2 })
      .expect(201)
  ).body;
  await student.agent.delete(`/api/recordings/${other}`).expect(204);
  await student.agent.delete(`/api/tempo-marks/${mark.id}`).expect(404);
});
