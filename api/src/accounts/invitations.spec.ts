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
import { SIGN_IN_FAILED } from '../auth/sign-in.service';
import { MailService } from '../mail/mail.service';
import { INVITATION_NOT_VALID } from './invitations.service';

const unique = () => Math.random().toString(36).slice(2, 10);

describe('lab members and invitations over HTTP', () => {
  let testApp: TestApp;

  beforeAll(async () => {
    testApp = await createTestApp();
  });
  afterAll(() => testApp.close());

  it('invites a new person by mail; following the link creates the account, joins the lab and signs in', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['pi']);
    const email = `invitee-${unique()}@test.provenote.test`;
    await members.pi.agent.post(`/api/labs/${labId}/invitations`).send({ email, role: 'analyst' }).expect(204);
    const mail = await mailTo(testApp, email, /invites you/);
    expect(mail.text).toContain('as analyst');
    const token = tokenFromLink(testApp, mail, '/accept-invitation');

    const visitor = await anonymousAgent(testApp);
    const preview = await visitor.get(`/api/invitations/${token}`).expect(200);
    expect(preview.body).toMatchObject({ email, role: 'analyst', hasAccount: false });
    const weak = await visitor.post(`/api/invitations/${token}/accept`).send({ password: 'short', displayName: 'Ana' });
    expect(weak.status).toBe(400);
    await visitor
      .post(`/api/invitations/${token}/accept`)
      .send({ password: 'a fine long password', displayName: 'Ana Petrova' })
      .expect(200);
    const me = await visitor.get('/api/me').expect(200);
    expect(me.body.memberships).toEqual([expect.objectContaining({ labId, role: 'analyst' })]);
    await signIn(testApp, email, 'a fine long password');

    const again = await (
      await anonymousAgent(testApp)
    )
      .post(`/api/invitations/${token}/accept`)
      .send({ password: 'a fine long password', displayName: 'Ana Petrova' });
    expect([again.status, again.body.message]).toEqual([400, INVITATION_NOT_VALID]);

    const audit = await members.pi.agent.get(`/api/labs/${labId}/audit`).expect(200);
    expect(audit.body.events.map((e: { action: string }) => e.action)).toEqual(['member.joined', 'invitation.sent']);
    const outbox = await members.pi.agent.get(`/api/labs/${labId}/outbox`).expect(200);
    expect(outbox.body.map((m: { subject: string }) => m.subject)).toEqual([mail.subject]);
  });

  it('links an existing account when its own password is given, and refuses a wrong one', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['pi']);
    const existing = await createUser(testApp);
    await members.pi.agent
      .post(`/api/labs/${labId}/invitations`)
      .send({ email: existing.email, role: 'guest' })
      .expect(204);
    const token = tokenFromLink(testApp, await mailTo(testApp, existing.email), '/accept-invitation');
    const visitor = await anonymousAgent(testApp);
    expect((await visitor.get(`/api/invitations/${token}`)).body.hasAccount).toBe(true);
    const wrong = await visitor.post(`/api/invitations/${token}/accept`).send({ password: 'not my password' });
    expect([wrong.status, wrong.body.message]).toEqual([401, SIGN_IN_FAILED]);
    await visitor.post(`/api/invitations/${token}/accept`).send({ password: TEST_PASSWORD }).expect(200);
    const me = await visitor.get('/api/me').expect(200);
    expect(me.body.user.displayName).toBe(existing.displayName);
    expect(me.body.memberships).toEqual([expect.objectContaining({ labId, role: 'guest' })]);
  });

  it('resending replaces the link; revoking and expiry make it useless', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['pi']);
    const email = `later-${unique()}@test.provenote.test`;
    const pi = members.pi.agent;
    await pi.post(`/api/labs/${labId}/invitations`).send({ email, role: 'student' }).expect(204);
    const first = tokenFromLink(testApp, await mailTo(testApp, email), '/accept-invitation');
    const [pending] = (await pi.get(`/api/labs/${labId}/invitations`).expect(200)).body;
    expect(pending).toMatchObject({ email, role: 'student', invitedBy: members.pi.user.displayName });

    await pi.post(`/api/labs/${labId}/invitations/${pending.id}/resend`).expect(204);
    const resent = await testApp.app
      .get(MailService)
      .embedded!.waitFor((mail) => mail.to.includes(email) && !mail.text.includes(first));
    const second = tokenFromLink(testApp, resent, '/accept-invitation');
    const visitor = await anonymousAgent(testApp);
    await visitor.get(`/api/invitations/${first}`).expect(404);
    await visitor.get(`/api/invitations/${second}`).expect(200);

    await testApp.app
      .get(DataSource)
      .query(`UPDATE invitations SET expires_at = now() - interval '1 second' WHERE id = $1`, [pending.id]);
    const expired = await visitor
      .post(`/api/invitations/${second}/accept`)
      .send({ password: 'a fine long password', displayName: 'Late Comer' });
    expect([expired.status, expired.body.message]).toEqual([400, INVITATION_NOT_VALID]);
    // Still listed, so the PI can resend it.
    expect((await pi.get(`/api/labs/${labId}/invitations`).expect(200)).body).toHaveLength(1);

    await pi.delete(`/api/labs/${labId}/invitations/${pending.id}`).expect(204);
    expect((await pi.get(`/api/labs/${labId}/invitations`).expect(200)).body).toEqual([]);
    await pi.post(`/api/labs/${labId}/invitations/${pending.id}/resend`).expect(404);
  });

  it('changes roles and removes members, but never the last PI, and logs it', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['pi', 'analyst', 'student']);
    const pi = members.pi.agent;
    const list = (await pi.get(`/api/labs/${labId}/members`).expect(200)).body as {
      membershipId: string;
      role: string;
    }[];
    const byRole = Object.fromEntries(list.map((m) => [m.role, m.membershipId]));

    const lastPi = await pi.patch(`/api/labs/${labId}/members/${byRole.pi}`).send({ role: 'analyst' });
    expect([lastPi.status, lastPi.body.message]).toEqual([409, expect.stringMatching(/at least one PI/)]);
    await pi.delete(`/api/labs/${labId}/members/${byRole.pi}`).expect(409);

    await pi.patch(`/api/labs/${labId}/members/${byRole.student}`).send({ role: 'analyst' }).expect(204);
    await pi.delete(`/api/labs/${labId}/members/${byRole.analyst}`).expect(204);
    await members.analyst.agent.get(`/api/labs/${labId}`).expect(404);
    const roles = (await pi.get(`/api/labs/${labId}/members`).expect(200)).body.map((m: { role: string }) => m.role);
    expect(roles.sort()).toEqual(['analyst', 'pi']);

    const audit = await pi.get(`/api/labs/${labId}/audit`).expect(200);
    expect(audit.body.events.map((e: { action: string }) => e.action)).toEqual([
      'member.removed',
      'member.role_changed',
    ]);
    expect(audit.body.events[1].details).toMatchObject({ from: 'student', to: 'analyst' });
  });

  it('answers 404 for another lab’s members and invitations, even to a PI', async () => {
    const home = await createLabWithMembers(testApp, ['pi']);
    const other = await createLabWithMembers(testApp, ['pi', 'analyst']);
    const otherMembers = (await other.members.pi.agent.get(`/api/labs/${other.labId}/members`)).body as {
      membershipId: string;
    }[];
    const intruder = home.members.pi.agent;
    await intruder.get(`/api/labs/${other.labId}/members`).expect(404);
    await intruder
      .patch(`/api/labs/${other.labId}/members/${otherMembers[1].membershipId}`)
      .send({ role: 'pi' })
      .expect(404);
    // The PI's own lab in the path does not reach another lab's membership either.
    await intruder.delete(`/api/labs/${home.labId}/members/${otherMembers[1].membershipId}`).expect(404);
    expect((await other.members.pi.agent.get(`/api/labs/${other.labId}/members`)).body).toHaveLength(2);
  });

  it('limits how many invitations a lab can send in an hour', async () => {
    const { labId, members } = await createLabWithMembers(testApp, ['pi']);
    const statuses: number[] = [];
    for (let i = 0; i < 31; i++) {
      const res = await members.pi.agent
        .post(`/api/labs/${labId}/invitations`)
        .send({ email: `bulk-${i}-${unique()}@test.provenote.test`, role: 'guest' });
      statuses.push(res.status);
    }
    expect(statuses.slice(0, 30).every((status) => status === 204)).toBe(true);
    expect(statuses[30]).toBe(429);
  });
});
