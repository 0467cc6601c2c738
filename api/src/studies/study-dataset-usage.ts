import { Injectable, type OnModuleInit } from '@nestjs/common';
import { InjectDataSource } from '@nestjs/typeorm';
import { DataSource } from 'typeorm';
import { DatasetUsageRegistry } from '../datasets/dataset-usage';

/** A signed-off study pins its dataset versions for good: deleting one of them is refused, naming the study. */
@Injectable()
export class StudyDatasetUsage implements OnModuleInit {
  constructor(
    @InjectDataSource() private readonly dataSource: DataSource,
    private readonly registry: DatasetUsageRegistry,
  ) {}

  onModuleInit() {
    this.registry.register(async (versionIds) => {
      const rows: { name: string }[] = await this.dataSource.query(
        `SELECT s.name FROM studies s JOIN study_steps d ON d.study_id = s.id AND d.key = 'data'
         WHERE s.signed_off_at IS NOT NULL
           AND (d.parameters->>'referenceVersionId' = ANY($1::text[]) OR d.parameters->>'unknownsVersionId' = ANY($1::text[]))
         ORDER BY s.name`,
        [versionIds],
      );
      return rows.map((row) => `study "${row.name}", signed off, uses this data`);
    });
  }
}
