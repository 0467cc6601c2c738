import { DataSource } from 'typeorm';
import { createTestApp, type TestApp } from '../../test/test-app';
import {
  anonymousAgent,
  createLabWithMembers,
  createUser,
  mailTo,
  signIn,
  TEST_PASSWORD,
  tokenFromLink,
} from '../../test/auth-helpers';
import { FAILED_SIGN_INS_PER_ACCOUNT, SIGN_IN_FAILED } from './sign-in.service';
import { LINK_NOT_VALID } from './mail-token.service';

const unique = () => Math.random().toString(36).slice(2, 10);

describe('sign-in, sign-up and password reset over HTTP', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(() => testApp.close());

  it('signs in with an httpOnly SameSite=Lax session cookie, lists memberships, and signs out', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['analyst']);
    const agent = await anonymousAgent(testApp);
    const res = await agent
      .post('/api/auth/sign-in')
      .send({ email: members.analyst.user.email.toUpperCase(), password: TEST_PASSWORD })
      .expect(200);
    const cookie = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith('provenote_session='));
    expect(cookie).toMatch(/HttpOnly/);
    expect(cookie).toMatch(/SameSite=Lax/);
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.memberships).toEqual([{ labId, labName: expect.any(String), role: 'analyst' }]);
    await agent.post('/api/auth/sign-out').expect(204);
    await agent.get('/api/me').expect(401);
  });

  it('answers a wrong password and an unknown e-mail alike', async () => {
    const user = await createUser(testApp);
    const agent = await anonymousAgent(testApp);
    const wrong = await agent.post('/api/auth/sign-in').send({ email: user.email, password: 'not the password' });
    const unknown = await agent
      .post('/api/auth/sign-in')
      .send({ email: `nobody-${unique()}@test.provenote.test`, password: 'not the password' });
    expect([wrong.status, wrong.body.message]).toEqual([401, SIGN_IN_FAILED]);
    expect([unknown.status, unknown.body.message]).toEqual([401, SIGN_IN_FAILED]);
  });

  it('throttles repeated failed sign-ins of one account, even with the right password afterwards', async () => {
    const user = await createUser(testApp);
    const agent = await anonymousAgent(testApp);
    for (let i = 0; i < FAILED_SIGN_INS_PER_ACCOUNT; i++) {
      await agent
        .post('/api/auth/sign-in')
        .send({ email: user.email, password: `guess ${i}` })
        .expect(401);
    }
    const blocked = await agent.post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.message).toMatch(/Too many attempts/);
  });

  it('expires sessions on the server side', async () => {
    const user = await createUser(testApp);
    const agent = await signIn(testApp, user.email);
    await agent.get('/api/me').expect(200);
    await testApp.app
      .get(DataSource)
      .query(`UPDATE sessions SET expires_at = now() - interval '1 second' WHERE user_id = $1`, [user.id]);
    await agent.get('/api/me').expect(401);
  });

  it('signs up through the link in the confirmation mail, once only', async () => {
    const email = `new-${unique()}@test.provenote.test`;
    const agent = await anonymousAgent(testApp);
    const body = { email, displayName: 'Mira Okafor', password: 'a long enough secret', labName: 'Basalt group' };
    const res = await agent.post('/api/auth/sign-up').send(body).expect(202);
    expect(res.body.message).toMatch(/sent a link/);
    const token = tokenFromLink(testApp, await mailTo(testApp, email, /Confirm/), '/confirm-sign-up');
    await agent.post('/api/auth/sign-up/confirm').send({ token }).expect(200);
    const me = await agent.get('/api/me').expect(200);
    expect(me.body.memberships).toEqual([expect.objectContaining({ labName: 'Basalt group', role: 'pi' })]);

    const reused = await (await anonymousAgent(testApp)).post('/api/auth/sign-up/confirm').send({ token });
    expect([reused.status, reused.body.message]).toEqual([400, LINK_NOT_VALID]);
    await signIn(testApp, email, body.password);
  });

  it('answers sign-up for an existing address the same way, and mails its owner instead', async () => {
    const user = await createUser(testApp);
    const agent = await anonymousAgent(testApp);
    const res = await agent
      .post('/api/auth/sign-up')
      .send({ email: user.email, displayName: 'Someone', password: 'a long enough secret', labName: 'Other lab' })
      .expect(202);
    expect(res.body.message).toMatch(/sent a link/);
    expect((await mailTo(testApp, user.email)).subject).toBe('You already have a Provenote account');
  });

  it('refuses a sign-up whose password breaks the rule, saying what to fix', async () => {
    const agent = await anonymousAgent(testApp);
    const res = await agent
      .post('/api/auth/sign-up')
      .send({ email: `x-${unique()}@test.provenote.test`, displayName: 'X', password: 'short', labName: 'Lab' })
      .expect(400);
    expect(res.body.errors).toEqual([{ path: 'password', message: 'Use at least 10 characters' }]);
  });

  it('resets a password through the mailed link, ends old sessions, and refuses the link again', async () => {
    const user = await createUser(testApp);
    const oldSession = await signIn(testApp, user.email);
    const agent = await anonymousAgent(testApp);
    const res = await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    expect(res.body.message).toMatch(/If that address has an account/);
    const token = tokenFromLink(
      testApp,
      await mailTo(testApp, user.email, /new Provenote password/),
      '/reset-password',
    );

    await agent.post('/api/auth/password-reset/confirm').send({ token, password: 'my brand new password' }).expect(204);
    await oldSession.get('/api/me').expect(401);
    await signIn(testApp, user.email, 'my brand new password');
    const failed = await agent.post('/api/auth/sign-in').send({ email: user.email, password: TEST_PASSWORD });
    expect(failed.status).toBe(401);

    const reused = await agent
      .post('/api/auth/password-reset/confirm')
      .send({ token, password: 'yet another password' });
    expect([reused.status, reused.body.message]).toEqual([400, LINK_NOT_VALID]);
  });

  it('refuses an expired reset link', async () => {
    const user = await createUser(testApp);
    const agent = await anonymousAgent(testApp);
    await agent.post('/api/auth/password-reset').send({ email: user.email }).expect(202);
    const token = tokenFromLink(testApp, await mailTo(testApp, user.email), '/reset-password');
    await testApp.app
      .get(DataSource)
      .query(`UPDATE mail_tokens SET expires_at = now() - interval '1 second' WHERE email = $1`, [user.email]);
    const res = await agent.post('/api/auth/password-reset/confirm').send({ token, password: 'my brand new password' });
    expect([res.status, res.body.message]).toEqual([400, LINK_NOT_VALID]);
  });

  it('answers a reset for an unknown address exactly like one for a known address, and sends nothing', async () => {
    const agent = await anonymousAgent(testApp);
    const email = `ghost-${unique()}@test.provenote.test`;
    const res = await agent.post('/api/auth/password-reset').send({ email }).expect(202);
    expect(res.body.message).toMatch(/If that address has an account/);
    await expect(mailTo(testApp, email, undefined, 1000)).rejects.toThrow(/No matching mail/);
  });

  it('lists no demo sign-ins in a database without the demo lab', async () => {
    const res = await (await anonymousAgent(testApp)).get('/api/auth/demo-accounts').expect(200);
    expect(res.body).toEqual({ accounts: [], password: null });
  });
});
