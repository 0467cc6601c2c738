import { Injectable } from '@nestjs/common';
import { InjectRepository } from '@nestjs/typeorm';
import { EntityManager, FindOptionsWhere, LessThan, Repository } from 'typeorm';
import { auditActionSchema, type AuditPage, type AuditQuery } from '@provenote/shared';
import { AuditEvent } from './audit-event.entity';

export interface AuditRecord {
  labId: string;
  /** Who did it: the signed-in person (`@CurrentUser()`), or null for the system. */
  actor: { id: string; email: string } | null;
  /** `<thing>.<what happened>`, e.g. `group.approved`, `study.signed_off`, `export.created`. */
  action: string;
  target?: { type: string; id: string };
  /** Small, JSON-safe facts a PI would want later (old and new role, a file name); never secrets. */
  details?: Record<string, unknown>;
}

/**
 * The lab's audit log. Call `record` in the same transaction as the change (pass the EntityManager) so
 * that a change and its audit entry are stored together or not at all.
 */
@Injectable()
export class AuditService {
  constructor(@InjectRepository(AuditEvent) private readonly events: Repository<AuditEvent>) {}

  async record(entry: AuditRecord, manager?: EntityManager): Promise<void> {
    const action = auditActionSchema.parse(entry.action);
    const repository = manager ? manager.getRepository(AuditEvent) : this.events;
    await repository.save(
      repository.create({
        labId: entry.labId,
        actorId: entry.actor?.id ?? null,
        actorEmail: entry.actor?.email ?? null,
        action,
        targetType: entry.target?.type ?? null,
        targetId: entry.target?.id ?? null,
        details: entry.details ?? {},
      }),
    );
  }

  /** Newest first, a page at a time. */
  async list(labId: string, query: AuditQuery): Promise<AuditPage> {
    const where: FindOptionsWhere<AuditEvent> = { labId };
    if (query.before) where.createdAt = LessThan(new Date(query.before));
    if (query.action) where.action = query.action;
    const rows = await this.events.find({
      where,
      relations: { actor: true },
      order: { createdAt: 'DESC', id: 'DESC' },
      take: query.limit + 1,
    });
    const page = rows.slice(0, query.limit);
    return {
      events: page.map((row) => ({
        id: row.id,
        action: row.action,
        actor: { id: row.actorId, email: row.actorEmail, displayName: row.actor?.displayName ?? null },
        target: row.targetType && row.targetId ? { type: row.targetType, id: row.targetId } : null,
        details: row.details,
        createdAt: row.createdAt.toISOString(),
      })),
      nextBefore: rows.length > query.limit ? page[page.length - 1].createdAt.toISOString() : null,
    };
  }
}
