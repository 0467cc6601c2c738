import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { dataSourceOptions } from '../database/typeorm-options';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../demo/demo-accounts';
import { seedDemoLab } from '../demo/seed-demo-lab';

/**
 * Brings the database up to date for `npm start`: applies pending migrations, then loads the demo lab
 * when the database has no lab yet. Prints what it did.
 */
async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is missing');
  const dataSource = new DataSource(dataSourceOptions(url));
  await dataSource.initialize();
  try {
    const applied = await dataSource.runMigrations({ transaction: 'each' });
    if (applied.length > 0) console.log(`Applied migrations: ${applied.map((m) => m.name).join(', ')}`);
    const demo = process.env.PROVENOTE_DEMO !== 'off' ? await seedDemoLab(dataSource) : null;
    if (demo) console.log(demo);
  } finally {
    await dataSource.destroy();
  }
  console.log(JSON.stringify({ demoAccounts: DEMO_ACCOUNTS, demoPassword: DEMO_PASSWORD }));
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
