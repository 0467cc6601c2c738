import bcrypt from 'bcryptjs';
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import type TestAgent from 'supertest/lib/agent';
import { DataSource } from 'typeorm';
import { labRoles, type LabRole } from '@provenote/shared';
import { Lab } from '../src/accounts/lab.entity';
import { Membership } from '../src/accounts/membership.entity';
import { User } from '../src/accounts/user.entity';
import { CSRF_HEADER } from '../src/auth/session-cookies';
import type { ReceivedMail } from '../src/mail/embedded-smtp';
import { MailService } from '../src/mail/mail.service';
import type { TestApp } from './test-app';

/** The password of every account these helpers create. */
export const TEST_PASSWORD = 'correct horse battery staple';
// A low work factor keeps tests fast; bcrypt reads the factor from the hash, so sign-in works unchanged.
const testPasswordHash = bcrypt.hashSync(TEST_PASSWORD, 4);

export type Agent = TestAgent;

export interface TestUser {
  id: string;
  email: string;
  displayName: string;
}

export interface SignedInMember {
  agent: Agent;
  user: TestUser;
}

const unique = () => randomBytes(5).toString('hex');

/**
 * A supertest agent that keeps cookies and sends the CSRF header on every request, not signed in.
 * Use it for public routes that change state (sign-in, sign-up, accepting an invitation).
 */
export async function anonymousAgent(testApp: TestApp): Promise<Agent> {
  const agent = request.agent(testApp.app.getHttpServer());
  const res = await agent.get('/api/auth/csrf').expect(200);
  agent.set(CSRF_HEADER, res.body.csrfToken);
  return agent;
}

/** Signs in through the real endpoint; fails the test with the server's answer when it does not work. */
export async function signIn(testApp: TestApp, email: string, password: string = TEST_PASSWORD): Promise<Agent> {
  const agent = await anonymousAgent(testApp);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`Sign-in of ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

/** An account with TEST_PASSWORD, written straight to the database (no mail, no rate limit). */
export async function createUser(testApp: TestApp, overrides: Partial<TestUser> = {}): Promise<TestUser> {
  const id = unique();
  const user = await testApp.app
    .get(DataSource)
    .getRepository(User)
    .save({
      email: overrides.email ?? `person-${id}@test.provenote.test`,
      displayName: overrides.displayName ?? `Test person ${id}`,
      passwordHash: testPasswordHash,
    });
  return { id: user.id, email: user.email, displayName: user.displayName };
}

export async function createLab(testApp: TestApp, name = `Test lab ${unique()}`): Promise<string> {
  const lab = await testApp.app.get(DataSource).getRepository(Lab).save({ name });
  return lab.id;
}

/** Adds a person to a lab with a role (both must exist). */
export async function addMember(testApp: TestApp, labId: string, userId: string, role: LabRole): Promise<void> {
  await testApp.app.get(DataSource).getRepository(Membership).insert({ labId, userId, role });
}

/**
 * A new lab with one signed-in member per role asked for (all four by default):
 * `const { labId, members } = await createLabWithMembers(testApp); await members.pi.agent.get(...)`.
 */
export async function createLabWithMembers<R extends LabRole = LabRole>(
  testApp: TestApp,
  roles: readonly R[] = labRoles as unknown as readonly R[],
): Promise<{ labId: string; members: Record<R, SignedInMember> }> {
  const labId = await createLab(testApp);
  const members = {} as Record<R, SignedInMember>;
  for (const role of roles) {
    const tag = unique();
    const user = await createUser(testApp, {
      email: `${role}-${tag}@test.provenote.test`,
      displayName: `Test ${role} ${tag}`,
    });
    await addMember(testApp, labId, user.id, role);
    members[role] = { user, agent: await signIn(testApp, user.email) };
  }
  return { labId, members };
}

/** The newest mail the embedded fake SMTP server received for this address (waits for it to arrive). */
export async function mailTo(
  testApp: TestApp,
  address: string,
  subject?: RegExp,
  timeoutMs = 5000,
): Promise<ReceivedMail> {
  const embedded = testApp.app.get(MailService).embedded;
  if (!embedded) throw new Error('mailTo needs MAIL_MODE=embedded');
  await embedded.waitFor((mail) => mail.to.includes(address) && (!subject || subject.test(mail.subject)), timeoutMs);
  const mail = embedded.list().find((m) => m.to.includes(address) && (!subject || subject.test(m.subject)));
  if (!mail) throw new Error(`No mail to ${address}`);
  return mail;
}

/** The `token` of the first link in a mail's text that points at `path` under PUBLIC_URL. */
export function tokenFromLink(testApp: TestApp, mail: ReceivedMail, path: string): string {
  const prefix = `${testApp.config.PUBLIC_URL}${path}?token=`;
  const line = mail.text.split(/\s+/).find((word) => word.startsWith(prefix));
  if (!line) throw new Error(`No ${path} link in the mail “${mail.subject}”:\n${mail.text}`);
  return new URL(line).searchParams.get('token') ?? '';
}
