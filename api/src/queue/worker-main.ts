import 'reflect-metadata';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { ConfigurationError, loadConfig } from '../config/config';
import { WorkerModule } from './worker.module';

/**
 * `npm run worker`: a process that only computes runs. Start any number, on any machine that reaches
 * the same PostgreSQL and Redis, with WORKER_CONCURRENCY jobs each. SIGTERM lets running jobs finish.
 */
async function bootstrap() {
  const config = loadConfig();
  const app = await NestFactory.createApplicationContext(WorkerModule.forRoot(config), {
    logger: ['log', 'warn', 'error'],
  });
  app.enableShutdownHooks();
  Logger.log(`Provenote worker started (pid ${process.pid})`, 'Worker');
}

bootstrap().catch((error: unknown) => {
  console.error(error instanceof ConfigurationError ? error.message : error);
  process.exit(1);
});
