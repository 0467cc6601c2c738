import { MigrationInterface, QueryRunner } from 'typeorm';

/** Principal-component and canonical-variate projections of classify runs, one jsonb row per method. */
export class RunProjections1796160000000 implements MigrationInterface {
  name = 'RunProjections1796160000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "run_projections" ("run_id" uuid NOT NULL, "method" text NOT NULL, "data" jsonb NOT NULL, CONSTRAINT "PK_run_projections" PRIMARY KEY ("run_id", "method"))`,
    );
    await queryRunner.query(
      `ALTER TABLE "run_projections" ADD CONSTRAINT "FK_run_projections_run" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "run_projections" DROP CONSTRAINT "FK_run_projections_run"`);
    await queryRunner.query(`DROP TABLE "run_projections"`);
  }
}
