import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource, InjectRepository } from '@nestjs/typeorm';
import { DataSource, EntityManager, Repository } from 'typeorm';
import type { LabRole, MyMembership } from '@provenote/shared';
import { AuditService } from '../audit/audit.service';
import type { AuthUser } from '../auth/auth.types';
import { Lab } from './lab.entity';
import { Membership } from './membership.entity';

@Injectable()
export class LabsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    @InjectRepository(Membership) private readonly memberships: Repository<Membership>,
    @InjectRepository(Lab) private readonly labs: Repository<Lab>,
    private readonly audit: AuditService,
  ) {}

  async membershipsOf(userId: string): Promise<MyMembership[]> {
    const rows = await this.memberships.find({
      where: { userId },
      relations: { lab: true },
      order: { lab: { name: 'ASC' } },
    });
    return rows.map((row) => ({ labId: row.labId, labName: row.lab.name, role: row.role }));
  }

  async get(labId: string, role: LabRole) {
    const lab = await this.labs.findOne({ where: { id: labId } });
    if (!lab) throw new NotFoundException('Lab not found');
    return { id: lab.id, name: lab.name, createdAt: lab.createdAt.toISOString(), myRole: role };
  }

  async rename(labId: string, name: string, actor: AuthUser): Promise<void> {
    await this.dataSource.transaction(async (manager) => {
      const lab = await manager.findOneOrFail(Lab, { where: { id: labId } });
      await manager.update(Lab, { id: labId }, { name });
      await this.audit.record(
        {
          labId,
          actor,
          action: 'lab.renamed',
          target: { type: 'lab', id: labId },
          details: { from: lab.name, to: name },
        },
        manager,
      );
    });
  }

  /** A new lab with its founder as PI. */
  async create(name: string, founder: AuthUser, outer?: EntityManager): Promise<Lab> {
    const run = <T>(work: (manager: EntityManager) => Promise<T>) =>
      outer ? work(outer) : this.dataSource.transaction(work);
    return run(async (manager) => {
      const lab = await manager.save(manager.create(Lab, { name }));
      await manager.insert(Membership, { labId: lab.id, userId: founder.id, role: 'pi' });
      await this.audit.record(
        { labId: lab.id, actor: founder, action: 'lab.created', target: { type: 'lab', id: lab.id } },
        manager,
      );
      return lab;
    });
  }
}
