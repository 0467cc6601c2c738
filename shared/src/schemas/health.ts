import { z } from 'zod';

export const serviceStateSchema = z.object({ ok: z.boolean(), detail: z.string().optional() });

/** GET /api/health */
export const healthSchema = z.object({
  status: z.enum(['ok', 'degraded']),
  version: z.string(),
  database: serviceStateSchema,
  queue: serviceStateSchema,
});
export type Health = z.infer<typeof healthSchema>;
