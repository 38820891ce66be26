// Every API route, as the app itself lists them (server/route-table.ts), asked by each kind of person: the
// owner of the things, their linked teacher, a teacher who is not linked, another player, an admin and an
// anonymous request. Each answer is written out here as designed (DEVELOPERS.md: anonymous 401, wrong role
// 403, someone else's thing 404 …). A route that is not in this table fails the first test, so a new route
// cannot be left out.
import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import {
  appRoutes,
  baseUrl,
  invitationToken,
  linkStudent,
  signedInUser,
  smallUpload,
  uniqueEmail,
  waitForAnalysis,
} from './helpers';
import { root } from '@/tests/setup/processes';

type Who = 'owner' | 'linkedTeacher' | 'otherTeacher' | 'otherPlayer' | 'admin' | 'anonymous';
const WHO: Who[] = ['owner', 'linkedTeacher', 'otherTeacher', 'otherPlayer', 'admin', 'anonymous'];
type Agent = ReturnType<typeof request.agent> | ReturnType<typeof request>;
type Person = Awaited<ReturnType<typeof signedInUser>>;
type Expect = Record<Who, number>;
const clip = fs.readFileSync(path.join(root, 'fixtures/clips/waltz-150.mp3'));

/** The things the routes are asked about, all owned by `owner` unless said otherwise. */
interface World {
  people: Record<Exclude<Who, 'anonymous'>, Person>;
  songId: string;
  recordingId: string;
  candidateId: string;
  passageId: string;
  noteId: string;
  setListId: string;
  spareStudent: Person;
  token: string;
}
let w: World;

// Answers by design, for the common kinds of route.
const all = (status: number): Expect => ({
  owner: status,
  linkedTeacher: status,
  otherTeacher: status,
  otherPlayer: status,
  admin: status,
  anonymous: status,
});
const signedIn = (status: number): Expect => ({ ...all(status), anonymous: 401 });
const read: Expect = {
  owner: 200,
  linkedTeacher: 200,
  otherTeacher: 404,
  otherPlayer: 404,
  admin: 200,
  anonymous: 401,
};
const ownerOnly = (status: number): Expect => ({
  owner: status,
  linkedTeacher: 404,
  otherTeacher: 404,
  otherPlayer: 404,
  admin: 404,
  anonymous: 401,
});
const ownerOrTeacher = (status: number): Expect => ({
  owner: status,
  linkedTeacher: status,
  otherTeacher: 404,
  otherPlayer: 404,
  admin: 404,
  anonymous: 401,
});
const teachersOnly = (status: number): Expect => ({
  owner: 403,
  linkedTeacher: status,
  otherTeacher: status,
  otherPlayer: 403,
  admin: status,
  anonymous: 401,
});
const adminOnly = (status: number): Expect => ({
  owner: 403,
  linkedTeacher: 403,
  otherTeacher: 403,
  otherPlayer: 403,
  admin: status,
  anonymous: 401,
});
const invitee = (status: number): Expect => ({
  owner: status,
  linkedTeacher: 403,
  otherTeacher: 403,
  otherPlayer: 403,
  admin: 403,
  anonymous: 401,
});

interface Case {
  expect: Expect;
  /** The request, with any fresh thing `prepare` made for this person. */
  send: (a: Agent, fresh: string) => request.Test;
  /** Makes a new target for each person (for deletes and one-time answers). */
  prepare?: () => Promise<string>;
}

const newCandidate = async () =>
  (
    await w.people.owner.agent
      .post(`/api/songs/${w.songId}/candidates`)
      .send({ bpm: 40 + Math.random() * 200 })
      .expect(201)
  ).body.id;
const newPassage = async () =>
  (
    await w.people.owner.agent
      .post(`/api/songs/${w.songId}/passages`)
      .send({ recordingId: w.recordingId, name: 'spare', startSec: 1, endSec: 2 })
      .expect(201)
  ).body.id;
const newNote = async () =>
  (
    await w.people.owner.agent
      .post(`/api/recordings/${w.recordingId}/notes`)
      .send({ text: 'spare', atSec: 1 })
      .expect(201)
  ).body.id;
const newTempoMark = async () =>
  (
    await w.people.owner.agent
      .post(`/api/recordings/${w.recordingId}/tempo-marks`)
      .send({ kind: 'rubato', startSec: 1, endSec: 2 })
      .expect(201)
  ).body.id;
const newSetList = async () =>
  (
    await w.people.owner.agent
      .post('/api/set-lists')
      .send({ name: 'Spare', songIds: [w.songId] })
      .expect(201)
  ).body.id;
const newSong = async () =>
  (await w.people.owner.agent.post('/api/songs').send({ title: 'Spare' }).expect(201)).body.id;
const newRecording = async () => {
  const id = (
    await w.people.owner.agent
      .post(`/api/songs/${w.songId}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'spare.mp3')
      .expect(201)
  ).body.id;
  await waitForAnalysis(w.people.owner.agent, id);
  return id;
};
/** An invitation to the owner's address (sent by the admin, who may invite too). */
const invitationToOwner = async () => {
  const since = Date.now();
  await w.people.admin.agent.post('/api/invitations').send({ email: w.people.owner.email }).expect(202);
  const token = await invitationToken(w.people.owner.email, baseUrl, since);
  return (await request(baseUrl).get(`/api/invitations/token/${token}`).expect(200)).body.id;
};
const invitationByLinkedTeacher = async () =>
  (
    await w.people.linkedTeacher.agent
      .post('/api/invitations')
      .send({ email: uniqueEmail('matrix-invited') })
      .expect(202)
  ).body.id;

const MATRIX: Record<string, Case> = {
  'ALL /api/auth/{*splat}': { expect: all(200), send: (a) => a.get('/api/auth/get-session') },
  'GET /api/health': { expect: all(200), send: (a) => a.get('/api/health') },
  'GET /api/dev/mail': {
    expect: all(200),
    send: (a) => a.get('/api/dev/mail').query({ to: 'nobody@players.example' }),
  },
  'GET /api/openapi.json': { expect: all(200), send: (a) => a.get('/api/openapi.json') },
  'GET /api/docs': { expect: all(200), send: (a) => a.get('/api/docs/') },
  'GET /api/me': { expect: signedIn(200), send: (a) => a.get('/api/me') },
  'GET /api/me/preferences': { expect: signedIn(200), send: (a) => a.get('/api/me/preferences') },
  'PATCH /api/me/preferences': {
    expect: signedIn(200),
    send: (a) => a.patch('/api/me/preferences').send({ noteDigests: true }),
  },

  'GET /api/songs': { expect: signedIn(200), send: (a) => a.get('/api/songs') },
  'POST /api/songs': { expect: signedIn(201), send: (a) => a.post('/api/songs').send({ title: 'Their own' }) },
  'GET /api/songs/:id': { expect: read, send: (a) => a.get(`/api/songs/${w.songId}`) },
  'PATCH /api/songs/:id': {
    expect: ownerOnly(200),
    send: (a) => a.patch(`/api/songs/${w.songId}`).send({ notes: 'practise slowly' }),
  },
  'DELETE /api/songs/:id': { expect: ownerOnly(204), prepare: newSong, send: (a, id) => a.delete(`/api/songs/${id}`) },
  'PATCH /api/songs/:id/tempos': {
    expect: ownerOrTeacher(200),
    send: (a) => a.patch(`/api/songs/${w.songId}/tempos`).send({ workingBpm: 120 }),
  },

  'GET /api/songs/:songId/recordings': { expect: read, send: (a) => a.get(`/api/songs/${w.songId}/recordings`) },
  'POST /api/songs/:songId/recordings': {
    expect: ownerOrTeacher(201),
    send: (a) =>
      a
        .post(`/api/songs/${w.songId}/recordings`)
        .field('kind', 'reference')
        .attach('file', smallUpload, 'reference.wav'),
  },
  'GET /api/recordings/:id': { expect: read, send: (a) => a.get(`/api/recordings/${w.recordingId}`) },
  'GET /api/recordings/:id/peaks': { expect: read, send: (a) => a.get(`/api/recordings/${w.recordingId}/peaks`) },
  'GET /api/recordings/:id/audio': { expect: read, send: (a) => a.get(`/api/recordings/${w.recordingId}/audio`) },
  'PATCH /api/recordings/:id': {
    expect: ownerOnly(200),
    send: (a) => a.patch(`/api/recordings/${w.recordingId}`).send({ label: 'Tuesday take' }),
  },
  // Only a failed analysis can be retried (409 for the owner of a finished one).
  'POST /api/recordings/:id/retry': {
    expect: ownerOnly(409),
    send: (a) => a.post(`/api/recordings/${w.recordingId}/retry`),
  },
  'DELETE /api/recordings/:id': {
    expect: ownerOnly(204),
    prepare: newRecording,
    send: (a, id) => a.delete(`/api/recordings/${id}`),
  },

  'GET /api/songs/:songId/candidates': { expect: read, send: (a) => a.get(`/api/songs/${w.songId}/candidates`) },
  'POST /api/songs/:songId/candidates': {
    expect: ownerOnly(201),
    send: (a) => a.post(`/api/songs/${w.songId}/candidates`).send({ bpm: 133 }),
  },
  'POST /api/songs/:songId/choose': {
    expect: ownerOnly(200),
    send: (a) => a.post(`/api/songs/${w.songId}/choose`).send({ bpm: 120 }),
  },
  'PATCH /api/candidates/:id': {
    expect: ownerOnly(200),
    send: (a) => a.patch(`/api/candidates/${w.candidateId}`).send({ rating: 4 }),
  },
  'DELETE /api/candidates/:id': {
    expect: ownerOnly(204),
    prepare: newCandidate,
    send: (a, id) => a.delete(`/api/candidates/${id}`),
  },

  'GET /api/songs/:songId/practice': { expect: read, send: (a) => a.get(`/api/songs/${w.songId}/practice`) },
  'POST /api/songs/:songId/practice': {
    expect: ownerOnly(201),
    send: (a) =>
      a
        .post(`/api/songs/${w.songId}/practice`)
        .send({ startBpm: 90, reachedBpm: 94, repetitions: 4, minutes: 8, clean: false }),
  },
  // Everyone signed in has a log of their own (empty for most): the answer never holds another person's entries
  // (tests/api/practice.test.ts checks the contents).
  'GET /api/practice': { expect: signedIn(200), send: (a) => a.get('/api/practice') },
  'GET /api/practice/export': { expect: signedIn(200), send: (a) => a.get('/api/practice/export') },
  'GET /api/songs/:songId/passages': { expect: read, send: (a) => a.get(`/api/songs/${w.songId}/passages`) },
  'POST /api/songs/:songId/passages': {
    expect: ownerOnly(201),
    send: (a) =>
      a
        .post(`/api/songs/${w.songId}/passages`)
        .send({ recordingId: w.recordingId, name: 'bars 2–3', startSec: 1.6, endSec: 4 }),
  },
  'PATCH /api/passages/:id': {
    expect: ownerOnly(200),
    send: (a) => a.patch(`/api/passages/${w.passageId}`).send({ name: 'the turn' }),
  },
  'PATCH /api/passages/:id/tempos': {
    expect: ownerOrTeacher(200),
    send: (a) => a.patch(`/api/passages/${w.passageId}/tempos`).send({ goalBpm: 150 }),
  },
  'DELETE /api/passages/:id': {
    expect: ownerOnly(204),
    prepare: newPassage,
    send: (a, id) => a.delete(`/api/passages/${id}`),
  },

  'GET /api/recordings/:recordingId/notes': {
    expect: read,
    send: (a) => a.get(`/api/recordings/${w.recordingId}/notes`),
  },
  'POST /api/recordings/:recordingId/notes': {
    expect: ownerOrTeacher(201),
    send: (a) => a.post(`/api/recordings/${w.recordingId}/notes`).send({ text: 'hello', atSec: 2 }),
  },
  'POST /api/notes/:id/replies': {
    expect: ownerOrTeacher(201),
    send: (a) => a.post(`/api/notes/${w.noteId}/replies`).send({ text: 'thanks' }),
  },
  'PATCH /api/notes/:id': {
    expect: ownerOrTeacher(200),
    send: (a) => a.patch(`/api/notes/${w.noteId}`).send({ resolved: true }),
  },
  // The owner wrote it: readers who are not its author are refused (403), the rest do not see it (404).
  'DELETE /api/notes/:id': {
    expect: { owner: 204, linkedTeacher: 403, otherTeacher: 404, otherPlayer: 404, admin: 403, anonymous: 401 },
    prepare: newNote,
    send: (a, id) => a.delete(`/api/notes/${id}`),
  },

  'GET /api/recordings/:recordingId/tempo-marks': {
    expect: read,
    send: (a) => a.get(`/api/recordings/${w.recordingId}/tempo-marks`),
  },
  'POST /api/recordings/:recordingId/tempo-marks': {
    expect: ownerOnly(201),
    send: (a) =>
      a.post(`/api/recordings/${w.recordingId}/tempo-marks`).send({ kind: 'ritardando', startSec: 2, endSec: 3 }),
  },
  'DELETE /api/tempo-marks/:id': {
    expect: ownerOnly(204),
    prepare: newTempoMark,
    send: (a, id) => a.delete(`/api/tempo-marks/${id}`),
  },

  'GET /api/set-lists': { expect: signedIn(200), send: (a) => a.get('/api/set-lists') },
  'POST /api/set-lists': {
    expect: signedIn(201),
    send: (a) => a.post('/api/set-lists').send({ name: 'Their own', songIds: [] }),
  },
  'GET /api/set-lists/:id': { expect: read, send: (a) => a.get(`/api/set-lists/${w.setListId}`) },
  'PATCH /api/set-lists/:id': {
    expect: ownerOnly(200),
    send: (a) => a.patch(`/api/set-lists/${w.setListId}`).send({ name: 'Friday' }),
  },
  'DELETE /api/set-lists/:id': {
    expect: ownerOnly(204),
    prepare: newSetList,
    send: (a, id) => a.delete(`/api/set-lists/${id}`),
  },

  'GET /api/students': { expect: teachersOnly(200), send: (a) => a.get('/api/students') },
  // The spare student is linked to the linked teacher only: the others have no such link to end.
  'DELETE /api/students/:studentId': {
    expect: { owner: 403, linkedTeacher: 204, otherTeacher: 404, otherPlayer: 403, admin: 404, anonymous: 401 },
    send: (a) => a.delete(`/api/students/${w.spareStudent.id}`),
  },
  'GET /api/teachers': { expect: signedIn(200), send: (a) => a.get('/api/teachers') },
  // Nobody is the other teacher's student: there is no link to end.
  'DELETE /api/teachers/:teacherId': {
    expect: signedIn(404),
    send: (a) => a.delete(`/api/teachers/${w.people.otherTeacher.id}`),
  },
  'GET /api/invitations/token/:token': { expect: all(200), send: (a) => a.get(`/api/invitations/token/${w.token}`) },
  'GET /api/invitations/received': { expect: signedIn(200), send: (a) => a.get('/api/invitations/received') },
  'POST /api/invitations/:id/accept': {
    expect: invitee(200),
    prepare: invitationToOwner,
    send: (a, id) => a.post(`/api/invitations/${id}/accept`),
  },
  'POST /api/invitations/:id/decline': {
    expect: invitee(204),
    prepare: invitationToOwner,
    send: (a, id) => a.post(`/api/invitations/${id}/decline`),
  },
  'GET /api/invitations': { expect: teachersOnly(200), send: (a) => a.get('/api/invitations') },
  'POST /api/invitations': {
    expect: teachersOnly(202),
    send: (a) => a.post('/api/invitations').send({ email: uniqueEmail('matrix-new') }),
  },
  'DELETE /api/invitations/:id': {
    expect: { owner: 403, linkedTeacher: 204, otherTeacher: 404, otherPlayer: 403, admin: 404, anonymous: 401 },
    prepare: invitationByLinkedTeacher,
    send: (a, id) => a.delete(`/api/invitations/${id}`),
  },

  'GET /api/admin/users': { expect: adminOnly(200), send: (a) => a.get('/api/admin/users') },
  'PATCH /api/admin/users/:id/role': {
    expect: adminOnly(200),
    send: (a) => a.patch(`/api/admin/users/${w.people.otherPlayer.id}/role`).send({ role: 'player' }),
  },
};

beforeAll(async () => {
  const people = {
    owner: await signedInUser('matrix-owner'),
    linkedTeacher: await signedInUser('matrix-teacher', 'teacher'),
    otherTeacher: await signedInUser('matrix-other-teacher', 'teacher'),
    otherPlayer: await signedInUser('matrix-player'),
    admin: await signedInUser('matrix-admin', 'admin'),
  };
  const spareStudent = await signedInUser('matrix-spare');
  await linkStudent(people.linkedTeacher, people.owner);
  await linkStudent(people.linkedTeacher, spareStudent);
  const songId = (
    await people.owner.agent.post('/api/songs').send({ title: 'Harbour Lane Hornpipe', goalBpm: 120 }).expect(201)
  ).body.id;
  const recordingId = (
    await people.owner.agent
      .post(`/api/songs/${songId}/recordings`)
      .field('kind', 'take')
      .attach('file', clip, 'take.mp3')
      .expect(201)
  ).body.id;
  await waitForAnalysis(people.owner.agent, recordingId);
  const candidateId = (await people.owner.agent.post(`/api/songs/${songId}/candidates`).send({ bpm: 118 }).expect(201))
    .body.id;
  const passageId = (
    await people.owner.agent
      .post(`/api/songs/${songId}/passages`)
      .send({ recordingId, name: 'bars 1–2', startSec: 0, endSec: 1.6 })
      .expect(201)
  ).body.id;
  const noteId = (
    await people.owner.agent
      .post(`/api/recordings/${recordingId}/notes`)
      .send({ text: 'first try', atSec: 0.5 })
      .expect(201)
  ).body.id;
  const setListId = (
    await people.owner.agent
      .post('/api/set-lists')
      .send({ name: 'Friday', songIds: [songId] })
      .expect(201)
  ).body.id;
  const since = Date.now();
  const invited = uniqueEmail('matrix-token');
  await people.otherTeacher.agent.post('/api/invitations').send({ email: invited }).expect(202);
  const token = await invitationToken(invited, baseUrl, since);
  w = { people, songId, recordingId, candidateId, passageId, noteId, setListId, spareStudent, token };
}, 120_000);

test('every route the app mounts is in the matrix, and the matrix names no route the app lacks', () => {
  const routes = appRoutes(JSON.parse(process.env.TACTUS_TEST_SERVER_ENV!)).map((r) => `${r.method} ${r.path}`);
  expect(routes.filter((r) => !(r in MATRIX))).toEqual([]);
  expect(Object.keys(MATRIX).filter((k) => !routes.includes(k))).toEqual([]);
});

describe.each(Object.entries(MATRIX))('%s', (_route, c) => {
  test.each(WHO)('as %s', async (who) => {
    const fresh = c.prepare ? await c.prepare() : '';
    const agent: Agent = who === 'anonymous' ? request(baseUrl) : w.people[who].agent;
    const res = await c.send(agent, fresh);
    expect({ who, status: res.status }).toEqual({ who, status: c.expect[who] });
  });
});
