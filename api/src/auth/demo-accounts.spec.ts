import { DataSource } from 'typeorm';
import { createTestApp, type TestApp } from '../../test/test-app';
import { anonymousAgent, signIn } from '../../test/auth-helpers';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../demo/demo-accounts';
import { seedDemo } from '../demo/seed-demo';

describe('demo sign-ins', () => {
  const apps: TestApp[] = [];
  afterAll(() => Promise.all(apps.map((app) => app.close())));

  it('are listed in the embedded mode once the demo lab is loaded, and work', async () => {
    const testApp = await createTestApp({ MAIL_MODE: 'embedded' });
    apps.push(testApp);
    expect(await seedDemo(testApp.app.get(DataSource))).toBe(true);
    const res = await (await anonymousAgent(testApp)).get('/api/auth/demo-accounts').expect(200);
    expect(res.body).toEqual({ accounts: DEMO_ACCOUNTS, password: DEMO_PASSWORD });
    expect(DEMO_ACCOUNTS.map((account) => account.role)).toEqual(['pi', 'analyst', 'student', 'guest']);
    const guest = await signIn(testApp, 'guest@demo.provenote.test', DEMO_PASSWORD);
    const me = await guest.get('/api/me').expect(200);
    expect(me.body.memberships).toEqual([expect.objectContaining({ role: 'guest' })]);
  });

  it('are never listed when mail goes to a real server, even with the demo lab loaded', async () => {
    const testApp = await createTestApp({ MAIL_MODE: 'smtp', SMTP_URL: 'smtp://127.0.0.1:2525' });
    apps.push(testApp);
    await seedDemo(testApp.app.get(DataSource));
    const res = await (await anonymousAgent(testApp)).get('/api/auth/demo-accounts').expect(200);
    expect(res.body).toEqual({ accounts: [], password: null });
  });
});
