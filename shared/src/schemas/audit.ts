import { z } from 'zod';

/**
 * What an audit event records: `<thing>.<what happened>` in lower snake case, e.g. `member.role_changed`,
 * `group.approved`, `study.signed_off`, `export.created`, `dataset.deleted`.
 */
export const auditActionSchema = z
  .string()
  .regex(/^[a-z][a-z0-9_]*(\.[a-z][a-z0-9_]*)+$/, { error: 'An audit action looks like thing.what_happened' });

/** GET /api/labs/:labId/audit */
export const auditEventSchema = z.object({
  id: z.uuid(),
  action: auditActionSchema,
  actor: z.object({ id: z.uuid().nullable(), email: z.string().nullable(), displayName: z.string().nullable() }),
  target: z.object({ type: z.string(), id: z.string() }).nullable(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.iso.datetime(),
});
export type AuditEventView = z.infer<typeof auditEventSchema>;

export const auditPageSchema = z.object({
  events: z.array(auditEventSchema),
  /** Pass as `before` to get the next (older) page; null on the last page. */
  nextBefore: z.string().nullable(),
});
export type AuditPage = z.infer<typeof auditPageSchema>;

export const auditQuerySchema = z.object({
  before: z.iso.datetime().optional(),
  limit: z.coerce.number().int().min(1).max(200).default(50),
  action: z.string().max(100).optional(),
});
export type AuditQuery = z.infer<typeof auditQuerySchema>;
