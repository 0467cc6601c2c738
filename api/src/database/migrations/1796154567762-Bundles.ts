import { MigrationInterface, QueryRunner } from 'typeorm';

export class Bundles1796154567762 implements MigrationInterface {
  name = 'Bundles1796154567762';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "bundles" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "study_id" uuid NOT NULL, "origin" text NOT NULL, "run_id" uuid, "source_run_id" uuid, "filename" text NOT NULL, "content" bytea, "size_bytes" integer, "sha256" text, "manifest" jsonb, "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_a9118b2e4597aede4d5d4c43433" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE UNIQUE INDEX "bundles_run_key" ON "bundles"  ("run_id") `);
    await queryRunner.query(`CREATE INDEX "bundles_study_created_idx" ON "bundles"  ("study_id", "created_at") `);
    await queryRunner.query(
      `ALTER TABLE "bundles" ADD CONSTRAINT "FK_eee933e5216e2452933ddf1045c" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "bundles" ADD CONSTRAINT "FK_706e6e65eeb17ba3138a1b08ef7" FOREIGN KEY ("study_id") REFERENCES "studies"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "bundles" ADD CONSTRAINT "FK_742abfa9fd5c1fc6b3296bbdfea" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "bundles" ADD CONSTRAINT "FK_956309564537c5fc5716a5cc89f" FOREIGN KEY ("created_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "bundles" DROP CONSTRAINT "FK_956309564537c5fc5716a5cc89f"`);
    await queryRunner.query(`ALTER TABLE "bundles" DROP CONSTRAINT "FK_742abfa9fd5c1fc6b3296bbdfea"`);
    await queryRunner.query(`ALTER TABLE "bundles" DROP CONSTRAINT "FK_706e6e65eeb17ba3138a1b08ef7"`);
    await queryRunner.query(`ALTER TABLE "bundles" DROP CONSTRAINT "FK_eee933e5216e2452933ddf1045c"`);
    await queryRunner.query(`DROP INDEX "public"."bundles_study_created_idx"`);
    await queryRunner.query(`DROP INDEX "public"."bundles_run_key"`);
    await queryRunner.query(`DROP TABLE "bundles"`);
  }
}
