import { DataSource } from 'typeorm';
import type { TestApp } from './test-app';

/** Polls the runs table until `accept` holds for the run, or fails after `timeoutMs`. */
export async function waitForRun(
  testApp: TestApp,
  runId: string,
  accept: (run: { status: string; progress: number; attempt: number }) => boolean,
  timeoutMs = 20_000,
) {
  const dataSource = testApp.app.get(DataSource);
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const [run] = (await dataSource.query(`SELECT status, progress, attempt, error FROM runs WHERE id = $1`, [
      runId,
    ])) as {
      status: string;
      progress: number;
      attempt: number;
      error: string | null;
    }[];
    if (run && accept(run)) return run;
    if (Date.now() > deadline)
      throw new Error(`run ${runId} did not get there in ${timeoutMs} ms: ${JSON.stringify(run)}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
