import { z } from 'zod';
import { runKindSchema, runStatusSchema } from './runs';

/** The one Bull queue all runs go through; job names are the run kinds. */
export const RUN_QUEUE_NAME = 'runs';
export const runJobNameSchema = runKindSchema;
export type RunJobName = z.infer<typeof runJobNameSchema>;

/** A job carries only the run id: its inputs are the run's snapshot in PostgreSQL, read by id. */
export const runJobPayloadSchema = z.object({ runId: z.uuid() });
export type RunJobPayload = z.infer<typeof runJobPayloadSchema>;

/**
 * What workers publish on the run-events channel (Redis pub/sub) and the API relays to browsers as
 * server-sent events: the state of one run after a change.
 */
export const runEventSchema = z.object({
  runId: z.uuid(),
  labId: z.uuid(),
  status: runStatusSchema,
  progress: z.number().min(0).max(1),
  phase: z.string(),
  error: z.string().nullable(),
  attempt: z.number().int().min(0),
});
export type RunEvent = z.infer<typeof runEventSchema>;
