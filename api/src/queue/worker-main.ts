import 'reflect-metadata';
import { setPriority } from 'node:os';
import { Logger } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { ConfigurationError, loadConfig } from '../config/config';
import { WorkerModule } from './worker.module';

/**
 * `npm run worker`: a process that only computes runs. Start any number, on any machine that reaches
 * the same PostgreSQL and Redis, with WORKER_CONCURRENCY jobs each. SIGTERM lets running jobs finish.
 */
/**
 * Runs are batch work that takes whatever CPU it is given; on a machine it shares with the api, a lower
 * priority lets the api answer page requests first and the runs take the CPU the api leaves idle.
 */
const WORKER_NICENESS = 10;

async function bootstrap() {
  const config = loadConfig();
  setPriority(WORKER_NICENESS);
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
