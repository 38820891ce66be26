// Sign-up, confirmation by e-mail, sign-in, sign-out and password reset against the real server and MariaDB.
import request from 'supertest';
import { agent, baseUrl, linkPath, PASSWORD, uniqueEmail, waitForMail } from './helpers';

describe('sign-in lifecycle', () => {
  test('sign up, confirm through the caught mail, sign in, sign out', async () => {
    const email = uniqueEmail('lifecycle');
    const a = agent();

    // The app sends callbackURL so that the confirmation link lands on the sign-in screen.
    const signUp = await a
      .post('/api/auth/sign-up/email')
      .send({ name: 'Greta Lind', email, password: PASSWORD, callbackURL: '/sign-in?confirmed=1' })
      .expect(200);
    expect(signUp.body.user.email).toBe(email);
    expect(signUp.body.user.emailVerified).toBe(false);
    expect(signUp.body.user.role).toBe('player');

    // Unconfirmed accounts cannot sign in yet; trying sends a fresh confirmation link (sendOnSignIn).
    const early = await a
      .post('/api/auth/sign-in/email')
      .send({ email, password: PASSWORD, callbackURL: '/sign-in?confirmed=1' });
    expect(early.status).toBe(403);
    expect(early.body.code).toBe('EMAIL_NOT_VERIFIED');

    const mail = await waitForMail(email, /confirm your e-mail/i);
    expect(mail.text).toContain('Hello Greta Lind');
    const confirm = await a.get(linkPath(mail)).expect(302);
    expect(confirm.headers.location).toContain('/sign-in?confirmed=1');

    await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
    const me = await a.get('/api/me').expect(200);
    expect(me.body).toMatchObject({ email, name: 'Greta Lind', role: 'player', emailVerified: true });

    await a.post('/api/auth/sign-out').send({}).expect(200);
    await a.get('/api/me').expect(401);
  });

  test('a wrong password is refused without saying which part was wrong', async () => {
    const email = uniqueEmail('wrongpw');
    const a = agent();
    await a.post('/api/auth/sign-up/email').send({ name: 'Wrong Pw', email, password: PASSWORD }).expect(200);
    await a.get(linkPath(await waitForMail(email, /confirm/i))).expect(302);
    const res = await a.post('/api/auth/sign-in/email').send({ email, password: 'not-the-password' });
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('INVALID_EMAIL_OR_PASSWORD');
  });

  test('password reset through the caught mail replaces the old password', async () => {
    const email = uniqueEmail('reset');
    const a = agent();
    await a.post('/api/auth/sign-up/email').send({ name: 'Reset Me', email, password: PASSWORD }).expect(200);
    await a.get(linkPath(await waitForMail(email, /confirm/i))).expect(302);

    await a.post('/api/auth/request-password-reset').send({ email, redirectTo: '/reset-password' }).expect(200);
    const mail = await waitForMail(email, /reset your tactus password/i);
    const redirect = await request(baseUrl).get(linkPath(mail)).expect(302);
    const token = new URL(redirect.headers.location!, baseUrl).searchParams.get('token');
    expect(token).toBeTruthy();

    const newPassword = 'ritardando-then-a-tempo';
    await a.post('/api/auth/reset-password').send({ token, newPassword }).expect(200);
    // The token is single-use.
    const again = await a.post('/api/auth/reset-password').send({ token, newPassword: 'yet-another-one' });
    expect(again.status).toBe(400);

    await agent().post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(401);
    await agent().post('/api/auth/sign-in/email').send({ email, password: newPassword }).expect(200);
  });

  test('signing up again with a taken e-mail changes nothing and does not reveal the account', async () => {
    const email = uniqueEmail('twice');
    const a = agent();
    await a.post('/api/auth/sign-up/email').send({ name: 'Once', email, password: PASSWORD }).expect(200);
    await a.get(linkPath(await waitForMail(email, /confirm/i))).expect(302);
    // With confirmation required, better-auth answers a repeat sign-up like a new one (no account enumeration)…
    await agent()
      .post('/api/auth/sign-up/email')
      .send({ name: 'Twice', email, password: 'other-password-1' })
      .expect(200);
    // …but the first account, its name and its password stand.
    await agent().post('/api/auth/sign-in/email').send({ email, password: 'other-password-1' }).expect(401);
    await a.post('/api/auth/sign-in/email').send({ email, password: PASSWORD }).expect(200);
    expect((await a.get('/api/me').expect(200)).body.name).toBe('Once');
  });
});
