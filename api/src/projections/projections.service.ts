import { Injectable, NotFoundException } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import type { Projection, ProjectionQuery, StoredProjection } from '@provenote/shared';

export const RUN_NOT_FOUND = 'Run not found';
export const NO_PROJECTION =
  'This run has no projection: projections are computed by assign runs once they have succeeded';

/** Reads a stored projection and keeps the one ellipse level asked for; nothing is computed here. */
@Injectable()
export class ProjectionsService {
  constructor(@InjectDataSource() private readonly dataSource: DataSource) {}

  async get(labId: string, runId: string, query: ProjectionQuery): Promise<Projection> {
    const rows = (await this.dataSource.query(
      `SELECT r.id, p.data FROM runs r
       LEFT JOIN run_projections p ON p.run_id = r.id AND p.method = $3
       WHERE r.id = $1 AND r.lab_id = $2`,
      [runId, labId, query.method],
    )) as { id: string; data: StoredProjection | null }[];
    if (rows.length === 0) throw new NotFoundException(RUN_NOT_FOUND);
    const data = rows[0].data;
    if (!data) throw new NotFoundException(NO_PROJECTION);
    const level = String(query.level);
    return {
      runId,
      method: query.method,
      level: query.level,
      unavailable: data.unavailable,
      basis: data.basis,
      ellipseBasis: data.ellipseBasis,
      axes: data.axes,
      reference: data.reference,
      unknowns: data.unknowns,
      unknownTotal: data.unknownTotal,
      groups: data.groups.map((group) => ({
        name: group.name,
        n: group.n,
        mean: group.mean,
        ellipse: group.ellipses?.[level] ?? null,
        ellipseNote: group.ellipseNote,
      })),
    };
  }
}
