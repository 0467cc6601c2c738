import { ConflictException, Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, EntityManager } from 'typeorm';
import type { LabRole, Member } from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { Membership } from './membership.entity';

const LAST_PI = 'A lab needs at least one PI: make someone else PI first';

@Injectable()
export class MembersService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly audit: AuditService,
  ) {}

  async list(labId: string): Promise<Member[]> {
    const rows = await this.dataSource.getRepository(Membership).find({
      where: { labId },
      relations: { user: true },
      order: { createdAt: 'ASC' },
    });
    return rows.map((row) => ({
      membershipId: row.id,
      userId: row.userId,
      email: row.user.email,
      displayName: row.user.displayName,
      role: row.role,
      joinedAt: row.createdAt.toISOString(),
    }));
  }

  async changeRole(labId: string, membershipId: string, role: LabRole, actor: AuthUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const membership = await this.lockedMembership(manager, labId, membershipId);
      if (membership.role === role) return;
      if (membership.role === 'pi') await this.assertAnotherPi(manager, labId);
      await manager.update(Membership, { id: membership.id }, { role });
      await this.audit.record(
        {
          labId,
          actor,
          action: 'member.role_changed',
          target: { type: 'user', id: membership.userId },
          details: { email: membership.user.email, from: membership.role, to: role },
        },
        manager,
      );
    });
  }

  async remove(labId: string, membershipId: string, actor: AuthUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const membership = await this.lockedMembership(manager, labId, membershipId);
      if (membership.role === 'pi') await this.assertAnotherPi(manager, labId);
      await manager.delete(Membership, { id: membership.id });
      await this.audit.record(
        {
          labId,
          actor,
          action: 'member.removed',
          target: { type: 'user', id: membership.userId },
          details: { email: membership.user.email, role: membership.role },
        },
        manager,
      );
    });
  }

  /** Lab rows are locked so that two PIs demoting each other at once cannot leave the lab without one. */
  private async lockedMembership(manager: EntityManager, labId: string, membershipId: string) {
    await manager.query('SELECT id FROM labs WHERE id = $1 FOR UPDATE', [labId]);
    const membership = await manager.findOne(Membership, {
      where: { id: membershipId, labId },
      relations: { user: true },
    });
    if (!membership) throw new NotFoundException('No such member in this lab');
    return membership;
  }

  private async assertAnotherPi(manager: EntityManager, labId: string) {
    const pis = await manager.count(Membership, { where: { labId, role: 'pi' } });
    if (pis < 2) throw new ConflictException(LAST_PI);
  }
}
