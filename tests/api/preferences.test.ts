// A person's own settings: GET/PATCH /api/me/preferences (the note digest, the player's stretch method).
import { signedInUser } from './helpers';

test('the stretch method is the phase vocoder until the person chooses overlap-add, and stays theirs', async () => {
  const player = await signedInUser('stretch-pref');
  const other = await signedInUser('stretch-pref-other');
  expect((await player.agent.get('/api/me/preferences').expect(200)).body).toEqual({
    noteDigests: true,
    stretchMethod: 'phase-vocoder',
  });
  const changed = await player.agent.patch('/api/me/preferences').send({ stretchMethod: 'overlap-add' }).expect(200);
  expect(changed.body).toEqual({ noteDigests: true, stretchMethod: 'overlap-add' });
  expect((await player.agent.get('/api/me/preferences').expect(200)).body.stretchMethod).toBe('overlap-add');
  // Another person's setting is untouched.
  expect((await other.agent.get('/api/me/preferences').expect(200)).body.stretchMethod).toBe('phase-vocoder');
});

test('an unknown stretch method is refused in plain words and changes nothing', async () => {
  const player = await signedInUser('stretch-pref-bad');
  const res = await player.agent.patch('/api/me/preferences').send({ stretchMethod: 'faster' }).expect(400);
  expect(res.body.error.field).toBe('stretchMethod');
  expect(res.body.error.message).toMatch(/phase-vocoder or overlap-add/);
  expect((await player.agent.get('/api/me/preferences').expect(200)).body.stretchMethod).toBe('phase-vocoder');
});
