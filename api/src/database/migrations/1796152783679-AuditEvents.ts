import { MigrationInterface, QueryRunner } from 'typeorm';

export class AuditEvents1796152783679 implements MigrationInterface {
  name = 'AuditEvents1796152783679';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "audit_events" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "actor_id" uuid, "actor_email" text, "action" text NOT NULL, "target_type" text, "target_id" text, "details" jsonb NOT NULL DEFAULT '{}', "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_910f64d901a5c3e9878f0d4a407" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "audit_events_lab_created_idx" ON "audit_events" ("lab_id", "created_at") `);
    await queryRunner.query(
      `ALTER TABLE "audit_events" ADD CONSTRAINT "FK_651cb4a7e7fe1f1f163d9af9656" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "audit_events" ADD CONSTRAINT "FK_04c7c044146c6632491a370fc04" FOREIGN KEY ("actor_id") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "audit_events" DROP CONSTRAINT "FK_04c7c044146c6632491a370fc04"`);
    await queryRunner.query(`ALTER TABLE "audit_events" DROP CONSTRAINT "FK_651cb4a7e7fe1f1f163d9af9656"`);
    await queryRunner.query(`DROP INDEX "public"."audit_events_lab_created_idx"`);
    await queryRunner.query(`DROP TABLE "audit_events"`);
  }
}
