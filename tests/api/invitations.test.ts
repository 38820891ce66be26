// Teachers and students link only by consent: a mailed one-time invitation that the invited address accepts.
// Either side ends the link at any time, and access stops at once.
import request from 'supertest';
import { baseUrl, invitationToken, linkStudent, query, signedInUser, uniqueEmail } from './helpers';

type Person = Awaited<ReturnType<typeof signedInUser>>;
let teacher: Person;

beforeAll(async () => {
  teacher = await signedInUser('inv-teacher', 'teacher');
});

const invite = async (email: string) => (await teacher.agent.post('/api/invitations').send({ email }).expect(202)).body;
const details = async (who: Person | null, token: string) =>
  (await (who ? who.agent : request(baseUrl)).get(`/api/invitations/token/${token}`).expect(200)).body;

test('the answer to an invitation is the same whether or not an account uses the address', async () => {
  const player = await signedInUser('inv-existing');
  const known = await invite(player.email);
  const unknown = await invite(uniqueEmail('inv-nobody'));
  expect(Object.keys(known).sort()).toEqual(Object.keys(unknown).sort());
  expect(known.status).toBe('pending');
  expect(unknown.status).toBe('pending');
  // No account is linked by inviting: the teacher sees nothing yet.
  const song = (await player.agent.post('/api/songs').send({ title: 'Quiet Harbour' }).expect(201)).body;
  await teacher.agent.get(`/api/songs/${song.id}`).expect(404);
  expect((await teacher.agent.get('/api/students').expect(200)).body.students).toEqual([]);
});

test('the mail names the teacher; accepting through its link links the two, and the teacher then reads the songs', async () => {
  const player = await signedInUser('inv-accept');
  const song = (await player.agent.post('/api/songs').send({ title: 'Saltmarsh Air' }).expect(201)).body;
  await invite(player.email);
  const token = await invitationToken(player.email);
  const seen = await details(null, token);
  expect(seen).toMatchObject({ teacherName: 'Test inv-teacher', email: player.email, status: 'pending', forYou: null });
  expect(
    (await player.agent.get('/api/invitations/received').expect(200)).body.invitations.map((i: { id: string }) => i.id),
  ).toContain(seen.id);
  const accepted = await player.agent.post(`/api/invitations/${seen.id}/accept`).expect(200);
  expect(accepted.body).toMatchObject({ id: teacher.id, name: 'Test inv-teacher' });
  expect((await teacher.agent.get(`/api/songs/${song.id}`).expect(200)).body.title).toBe('Saltmarsh Air');
  expect((await player.agent.get('/api/teachers').expect(200)).body.teachers.map((t: { id: string }) => t.id)).toEqual([
    teacher.id,
  ]);
  // One time only.
  const again = await player.agent.post(`/api/invitations/${seen.id}/accept`).expect(410);
  expect(again.body.error.code).toBe('answered');
});

test('declining links nothing, and the link cannot be used again', async () => {
  const player = await signedInUser('inv-decline');
  const song = (await player.agent.post('/api/songs').send({ title: 'Not for now' }).expect(201)).body;
  await invite(player.email);
  const { id } = await details(player, await invitationToken(player.email));
  await player.agent.post(`/api/invitations/${id}/decline`).expect(204);
  await teacher.agent.get(`/api/songs/${song.id}`).expect(404);
  await player.agent.post(`/api/invitations/${id}/accept`).expect(410);
});

test('an expired invitation cannot be accepted', async () => {
  const player = await signedInUser('inv-expired');
  await invite(player.email);
  const { id } = await details(player, await invitationToken(player.email));
  // Eight days on (the link works for seven).
  await query('tactus_test', 'UPDATE studio_invitations SET expiresAt = ? WHERE id = ?', [
    new Date(Date.now() - 24 * 3600 * 1000),
    id,
  ]);
  const res = await player.agent.post(`/api/invitations/${id}/accept`).expect(410);
  expect(res.body.error.code).toBe('expired');
  expect((await player.agent.get('/api/invitations/received').expect(200)).body.invitations).toEqual([]);
});

test('a withdrawn invitation is gone from the teacher’s list and cannot be accepted', async () => {
  const player = await signedInUser('inv-withdrawn');
  const sent = await invite(player.email);
  expect(
    (await teacher.agent.get('/api/invitations').expect(200)).body.invitations.map((i: { id: string }) => i.id),
  ).toContain(sent.id);
  await teacher.agent.delete(`/api/invitations/${sent.id}`).expect(204);
  expect(
    (await teacher.agent.get('/api/invitations').expect(200)).body.invitations.map((i: { id: string }) => i.id),
  ).not.toContain(sent.id);
  const seen = await details(player, await invitationToken(player.email));
  expect(seen.status).toBe('withdrawn');
  await player.agent.post(`/api/invitations/${sent.id}/accept`).expect(410);
});

test('another account cannot accept an invitation meant for someone else', async () => {
  const invited = await signedInUser('inv-meant');
  const other = await signedInUser('inv-other');
  await invite(invited.email);
  const seen = await details(other, await invitationToken(invited.email));
  expect(seen.forYou).toBe(false);
  const res = await other.agent.post(`/api/invitations/${seen.id}/accept`).expect(403);
  expect(res.body.error.code).toBe('wrong_account');
  expect(
    (await teacher.agent.get('/api/students').expect(200)).body.students.map((s: { id: string }) => s.id),
  ).not.toContain(other.id);
});

test('a new person signs up through the link and is linked when they accept after confirming', async () => {
  const email = uniqueEmail('inv-newcomer');
  await invite(email);
  const token = await invitationToken(email);
  expect((await details(null, token)).status).toBe('pending');
  const newcomer = await signedInUser('inv-newcomer', 'player', undefined, email);
  const seen = await details(newcomer, token);
  expect(seen.forYou).toBe(true);
  await newcomer.agent.post(`/api/invitations/${seen.id}/accept`).expect(200);
  expect(
    (await teacher.agent.get('/api/students').expect(200)).body.students.map((s: { email: string }) => s.email),
  ).toContain(email);
});

test('either side ends the link, and access stops with the next request', async () => {
  const player = await signedInUser('inv-end');
  const song = (await player.agent.post('/api/songs').send({ title: 'Borrowed Time' }).expect(201)).body;
  await linkStudent(teacher, player);
  await teacher.agent.get(`/api/songs/${song.id}`).expect(200);
  await player.agent.delete(`/api/teachers/${teacher.id}`).expect(204);
  await teacher.agent.get(`/api/songs/${song.id}`).expect(404);

  await linkStudent(teacher, player);
  await teacher.agent.get(`/api/songs/${song.id}`).expect(200);
  await teacher.agent.delete(`/api/students/${player.id}`).expect(204);
  await teacher.agent.get(`/api/songs/${song.id}`).expect(404);
  expect((await player.agent.get('/api/teachers').expect(200)).body.teachers).toEqual([]);
});

test('a teacher can no longer add anyone by typing an e-mail address; players cannot invite', async () => {
  const player = await signedInUser('inv-direct');
  await teacher.agent.post('/api/students').send({ email: player.email }).expect(404);
  await player.agent.post('/api/invitations').send({ email: teacher.email }).expect(403);
  const self = await teacher.agent.post('/api/invitations').send({ email: teacher.email }).expect(400);
  expect(self.body.error.field).toBe('email');
});
