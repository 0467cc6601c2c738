import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource, type FindOptionsWhere } from 'typeorm';
import { checkResultsSchema, type CheckResults, type CheckResultsQuery } from '@provenote/shared';
import { RunCheckMemberEntity } from '../runs/run-check-member.entity';
import { RunCheckPairEntity } from '../runs/run-check-pair.entity';
import { RunGroupEntity } from '../runs/run-group.entity';
import { RunEntity } from '../runs/run.entity';
import { StudiesService } from './studies.service';

/** Reads the results of the study's group check run as the card shows them. */
@Injectable()
export class CheckResultsService {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly studies: StudiesService,
  ) {}

  async get(labId: string, studyId: string, query: CheckResultsQuery): Promise<CheckResults> {
    const { steps } = await this.studies.load(labId, studyId);
    const check = steps.find((s) => s.key === 'check');
    const run = check?.runId
      ? await this.dataSource.getRepository(RunEntity).findOne({ where: { id: check.runId, labId } })
      : null;
    if (!run || run.status !== 'succeeded' || !run.summary) {
      throw new NotFoundException('The group check has no results yet; run it from its card');
    }
    const where: FindOptionsWhere<RunCheckMemberEntity> = { runId: run.id };
    if (query.outcome) where.outcome = query.outcome;
    if (query.group) where.groupName = query.group;
    if (query.flaggedByRobustFit !== undefined) where.robustOutlier = query.flaggedByRobustFit;
    const [members, total] = await this.dataSource.getRepository(RunCheckMemberEntity).findAndCount({
      where,
      order: { ordinal: 'ASC' },
      skip: (query.page - 1) * query.pageSize,
      take: query.pageSize,
    });
    const groups = await this.dataSource
      .getRepository(RunGroupEntity)
      .find({ where: { runId: run.id }, order: { groupIndex: 'ASC' } });
    const pairs = await this.dataSource
      .getRepository(RunCheckPairEntity)
      .find({ where: { runId: run.id }, order: { groupA: 'ASC', groupB: 'ASC' } });
    const summary = run.summary as Record<string, unknown>;
    // Parsed, so a change in what the worker stores fails here by name rather than in the browser.
    return checkResultsSchema.parse({
      runId: run.id,
      groups: groups.map((g) => ({ name: g.name, n: g.n, effectiveN: g.effectiveN })),
      variables: summary.variables ?? groups[0]?.variables ?? [],
      confusion: summary.confusion,
      returnedToOwnGroup: summary.returnedToOwnGroup,
      memberCount: summary.members,
      kruskalWallis: summary.kruskalWallis,
      robustFit: summary.robustFit,
      pairs: pairs.map(({ groupA, groupB, t2, f, df1, df2, p }) => ({ groupA, groupB, t2, f, df1, df2, p })),
      members: {
        total,
        page: query.page,
        pageSize: query.pageSize,
        rows: members.map((m) => ({
          sampleId: m.sampleId,
          group: m.groupName,
          d2: m.d2,
          d2LeaveOneOut: m.d2LeaveOneOut,
          pChi2LeaveOneOut: m.pChi2LeaveOneOut,
          pHotellingLeaveOneOut: m.pHotellingLeaveOneOut,
          outcome: m.outcome,
          bestGroup: m.bestGroup,
          robustD2: m.robustD2,
          flaggedByRobustFit: m.robustOutlier,
        })),
      },
    });
  }
}
