import type { NestExpressApplication } from '@nestjs/platform-express';
import { createApp } from '../src/app.factory';
import { type AppConfig, loadConfig } from '../src/config/config';
import { createTestDatabase, type TestDatabase } from './test-database';

export interface TestApp {
  app: NestExpressApplication;
  config: AppConfig;
  database: TestDatabase;
  close(): Promise<void>;
}

/** The whole api on a database of its own, initialised but not listening (use supertest on app.getHttpServer()). */
export async function createTestApp(env: Record<string, string> = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const config = loadConfig({
    NODE_ENV: 'test',
    DATABASE_URL: database.url,
    REDIS_URL: process.env.REDIS_URL,
    PORT: '0',
    ...env,
  });
  const app = await createApp(config, { logger: false });
  await app.init();
  return {
    app,
    config,
    database,
    close: async () => {
      await app.close();
      await database.drop();
    },
  };
}
