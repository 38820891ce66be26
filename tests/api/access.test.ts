// The access rule of server/services/access.ts, seen from outside: for each kind of thing, what the owner, a
// linked teacher, a teacher who is not linked, another player, an admin and an anonymous request get. The
// expected answers are written out here by hand (the product's rule: owner writes; owner, linked teacher and
// admin read; anyone else is told it does not exist; no session → 401), not read from the module.
import request from 'supertest';
import { baseUrl, linkStudent, signedInUser } from './helpers';

type Who = 'owner' | 'linkedTeacher' | 'otherTeacher' | 'otherPlayer' | 'admin' | 'anonymous';
const everyone: Who[] = ['owner', 'linkedTeacher', 'otherTeacher', 'otherPlayer', 'admin', 'anonymous'];
const READ: Record<Who, number> = {
  owner: 200,
  linkedTeacher: 200,
  otherTeacher: 404,
  otherPlayer: 404,
  admin: 200,
  anonymous: 401,
};
const WRITE: Record<Who, number> = {
  owner: 200,
  linkedTeacher: 404,
  otherTeacher: 404,
  otherPlayer: 404,
  admin: 404,
  anonymous: 401,
};
const CREATE: Record<Who, number> = { ...WRITE, owner: 201 };

let agents: Record<Who, request.Agent | ReturnType<typeof request>>;
let songId: string;
let candidateId: string;

beforeAll(async () => {
  const owner = await signedInUser('acc-owner');
  const linkedTeacher = await signedInUser('acc-teacher', 'teacher');
  const otherTeacher = await signedInUser('acc-other-teacher', 'teacher');
  const otherPlayer = await signedInUser('acc-player');
  const admin = await signedInUser('acc-admin', 'admin');
  await linkStudent(linkedTeacher, owner);
  agents = {
    owner: owner.agent,
    linkedTeacher: linkedTeacher.agent,
    otherTeacher: otherTeacher.agent,
    otherPlayer: otherPlayer.agent,
    admin: admin.agent,
    anonymous: request(baseUrl),
  };
  songId = (await owner.agent.post('/api/songs').send({ title: 'Saltmarsh Hornpipe', goalBpm: 112 }).expect(201)).body
    .id;
  candidateId = (await owner.agent.post(`/api/songs/${songId}/candidates`).send({ bpm: 96 }).expect(201)).body.id;
});

describe.each(everyone)('as %s', (who) => {
  test('songs: read and change', async () => {
    await agents[who].get(`/api/songs/${songId}`).expect(READ[who]);
    await agents[who]
      .patch(`/api/songs/${songId}`)
      .send({ notes: `by ${who}` })
      .expect(WRITE[who]);
  });

  test('candidate tempos: list, add, change', async () => {
    await agents[who].get(`/api/songs/${songId}/candidates`).expect(READ[who]);
    await agents[who]
      .post(`/api/songs/${songId}/candidates`)
      .send({ bpm: 100 + everyone.indexOf(who) })
      .expect(CREATE[who]);
    await agents[who].patch(`/api/candidates/${candidateId}`).send({ rating: 3 }).expect(WRITE[who]);
  });

  test('the practice log: read and add', async () => {
    await agents[who].get(`/api/songs/${songId}/practice`).expect(READ[who]);
    const entry = { startBpm: 80, reachedBpm: 84, repetitions: 4, minutes: 10, clean: false };
    await agents[who].post(`/api/songs/${songId}/practice`).send(entry).expect(CREATE[who]);
  });

  test('recordings of the song and their passages: list', async () => {
    await agents[who].get(`/api/songs/${songId}/recordings`).expect(READ[who]);
    await agents[who].get(`/api/songs/${songId}/passages`).expect(READ[who]);
  });
});

test('what was refused left no trace: only the owner’s changes are there', async () => {
  const song = (await agents.owner.get(`/api/songs/${songId}`).expect(200)).body;
  expect(song.notes).toBe('by owner');
  const bpms = (await agents.owner.get(`/api/songs/${songId}/candidates`).expect(200)).body.candidates.map(
    (c: { bpm: number }) => c.bpm,
  );
  expect(bpms).toEqual([96, 100]);
  expect((await agents.owner.get(`/api/songs/${songId}/practice`).expect(200)).body.entries).toHaveLength(1);
});
