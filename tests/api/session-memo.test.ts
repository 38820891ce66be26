// Whom a session cookie belongs to is remembered for a few seconds per process (middleware/session.ts); a
// sign-out must still end the session at once, even for a copy of the cookie sent again afterwards.
import request from 'supertest';
import { baseUrl, signedInUser } from './helpers';

test('a copied session cookie sent after sign-out is refused at once', async () => {
  const player = await signedInUser('memo');
  const cookie = (
    player.agent.jar.getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }) as unknown as {
      name: string;
      value: string;
    }[]
  )
    .map((c) => `${c.name}=${c.value}`)
    .join('; ');
  // Remembered now: the same cookie answers from the memo.
  await request(baseUrl).get('/api/me').set('Cookie', cookie).expect(200);
  await request(baseUrl).get('/api/me').set('Cookie', cookie).expect(200);
  await player.agent.post('/api/auth/sign-out').send({}).expect(200);
  const after = await request(baseUrl).get('/api/me').set('Cookie', cookie);
  expect(after.status).toBe(401);
});
