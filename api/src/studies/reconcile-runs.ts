import { In, type EntityManager } from 'typeorm';
import { applyRunOutcome } from '@provenote/shared';
import { RunEntity } from '../runs/run.entity';
import { StudyStepEntity } from './study-step.entity';

/**
 * Brings running cards up to date with their runs when a study is read: a finished run makes its card
 * current (or failed, with the reason). A finished assign run also opens the Review card, which reviews
 * that run's verdicts. Changes are written back, so every reader sees the same state.
 */
export async function reconcileRuns(manager: EntityManager, steps: StudyStepEntity[]): Promise<void> {
  const running = steps.filter((step) => step.status === 'running' && step.runId !== null);
  if (running.length === 0) return;
  const runs = await manager.getRepository(RunEntity).find({ where: { id: In(running.map((s) => s.runId)) } });
  const byId = new Map(runs.map((run) => [run.id, run]));
  const repository = manager.getRepository(StudyStepEntity);
  for (const step of running) {
    const run = byId.get(step.runId!);
    if (!run || run.status === 'queued' || run.status === 'running') continue;
    const next = applyRunOutcome(step, run.id, run.status);
    step.status = next.status;
    step.error = run.status === 'failed' ? (run.error ?? 'The run failed without a reason') : null;
    await repository.update(step.id, { status: step.status, error: step.error });
    const review = steps.find((s) => s.key === 'review');
    if (step.key === 'assign' && step.status === 'current' && review && review.status !== 'current') {
      review.status = 'current';
      await repository.update(review.id, { status: 'current' });
    }
  }
}
