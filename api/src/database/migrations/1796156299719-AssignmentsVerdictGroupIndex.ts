import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Results pages filtered by verdict and best group at once: without this index PostgreSQL read every row
 * of the verdict (34,000 of a 100,000-unknown run) to keep one group's (4,400), about 110 ms per page.
 */
export class AssignmentsVerdictGroupIndex1796156299719 implements MigrationInterface {
  name = 'AssignmentsVerdictGroupIndex1796156299719';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE INDEX "run_assignments_verdict_group_idx" ON "run_assignments"  ("run_id", "verdict", "group_name", "probability", "ordinal") `,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP INDEX "public"."run_assignments_verdict_group_idx"`);
  }
}
