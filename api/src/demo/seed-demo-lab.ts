import { NestFactory } from '@nestjs/core';
import type { DataSource } from 'typeorm';
import { AppModule } from '../app.module';
import { loadConfig } from '../config/config';
import { loadDemoScenario } from './demo-scenario';
import { FRESH_STUDY, REVIEWED_STUDY } from './demo-study-settings';
import { seedDemo } from './seed-demo';

/**
 * The demo lab for `npm start` on an empty database: the accounts, then the Lake Tarn scenario. Returns
 * what to tell the person starting it, or null when a lab existed and nothing was changed.
 *
 * The runs are computed here, before the API starts, by this process's own run workers (the same
 * processors the API's embedded workers use), so the message can say the study is computed when it is.
 */
export async function seedDemoLab(dataSource: DataSource): Promise<string | null> {
  if (!(await seedDemo(dataSource))) return null;
  const config = loadConfig({ ...process.env, WORKERS: 'embedded', WORKER_CONCURRENCY: '2' });
  const app = await NestFactory.createApplicationContext(AppModule.forRoot(config), { logger: ['error'] });
  try {
    await app.init();
    const { overriddenSampleId } = await loadDemoScenario(app);
    return [
      'Loaded the demo lab (synthetic data):',
      `  "${REVIEWED_STUDY.name}": group check and assignment computed, ${overriddenSampleId} overridden by the analyst; ready for the PI's review and sign-off.`,
      `  "${FRESH_STUDY.name}": only the Data card filled, to walk through.`,
    ].join('\n');
  } finally {
    await app.close();
  }
}
