// Candidate tempos, the chosen tempo and the practice log of a song.
import request from 'supertest';
import { baseUrl, signedInUser } from './helpers';

describe('candidate and chosen tempos', () => {
  test('a player adds candidates, rates them, chooses one with a note; it is saved to the song', async () => {
    const { agent } = await signedInUser('candidates');
    const song = (await agent.post('/api/songs').send({ title: 'Lanterns over Kessel Bay', meter: '6/8' }).expect(201))
      .body;
    for (const bpm of [140, 155, 170]) await agent.post(`/api/songs/${song.id}/candidates`).send({ bpm }).expect(201);
    const list = (await agent.get(`/api/songs/${song.id}/candidates`).expect(200)).body.candidates;
    expect(list.map((c: { bpm: number }) => c.bpm)).toEqual([140, 155, 170]);

    const rated = await agent
      .patch(`/api/candidates/${list[1].id}`)
      .send({ rating: 5, note: 'sings, the turn stays clear' })
      .expect(200);
    expect(rated.body).toMatchObject({ bpm: 155, rating: 5, note: 'sings, the turn stays clear' });
    const chosen = await agent
      .post(`/api/songs/${song.id}/choose`)
      .send({ bpm: 155, note: 'for the Harbour Lane recital' })
      .expect(200);
    expect(chosen.body).toMatchObject({ chosenBpm: 155, chosenNote: 'for the Harbour Lane recital' });
    expect((await agent.get(`/api/songs/${song.id}`).expect(200)).body.chosenBpm).toBe(155);

    await agent.delete(`/api/candidates/${list[0].id}`).expect(204);
    expect((await agent.get(`/api/songs/${song.id}/candidates`)).body.candidates).toHaveLength(2);
  });

  test('bad candidates are refused naming the field; strangers get 404, anonymous 401', async () => {
    const owner = await signedInUser('cand-owner');
    const stranger = await signedInUser('cand-stranger');
    const song = (await owner.agent.post('/api/songs').send({ title: 'Copperline Reel' }).expect(201)).body;
    const bad = await owner.agent.post(`/api/songs/${song.id}/candidates`).send({ bpm: 12 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('bpm');
    const badRating = await owner.agent.post(`/api/songs/${song.id}/candidates`).send({ bpm: 120, rating: 9 });
    expect(badRating.body.error.field).toBe('rating');
    const c = (await owner.agent.post(`/api/songs/${song.id}/candidates`).send({ bpm: 120 }).expect(201)).body;
    await stranger.agent.post(`/api/songs/${song.id}/candidates`).send({ bpm: 130 }).expect(404);
    await stranger.agent.patch(`/api/candidates/${c.id}`).send({ rating: 1 }).expect(404);
    await stranger.agent.post(`/api/songs/${song.id}/choose`).send({ bpm: 120 }).expect(404);
    await request(baseUrl).get(`/api/songs/${song.id}/candidates`).expect(401);
  });
});

describe('practice log', () => {
  test('logging a session, clean and faster or not, leaves the working tempo to the player (the app offers it)', async () => {
    const { agent } = await signedInUser('practice');
    const song = (
      await agent.post('/api/songs').send({ title: 'Nine Steps Waltz', goalBpm: 152, workingBpm: 120 }).expect(201)
    ).body;
    await agent
      .post(`/api/songs/${song.id}/practice`)
      .send({ startBpm: 120, reachedBpm: 128, repetitions: 12, minutes: 14, clean: true })
      .expect(201);
    expect((await agent.get(`/api/songs/${song.id}`)).body.workingBpm).toBe(120);
    await agent
      .post(`/api/songs/${song.id}/practice`)
      .send({ passage: 'bars 17–24', startBpm: 100, reachedBpm: 140, repetitions: 20, minutes: 10, clean: true })
      .expect(201);
    await agent
      .post(`/api/songs/${song.id}/practice`)
      .send({ startBpm: 128, reachedBpm: 136, repetitions: 4, minutes: 5, clean: false })
      .expect(201);
    expect((await agent.get(`/api/songs/${song.id}`)).body.workingBpm).toBe(120);
    const entries = (await agent.get(`/api/songs/${song.id}/practice`).expect(200)).body.entries;
    expect(entries).toHaveLength(3);
    const bad = await agent
      .post(`/api/songs/${song.id}/practice`)
      .send({ startBpm: 120, reachedBpm: 128, repetitions: 0, minutes: 3, clean: true });
    expect(bad.status).toBe(400);
    expect(bad.body.error.field).toBe('repetitions');
  });
});
