import { MigrationInterface, QueryRunner } from 'typeorm';

export class NotebookStudiesGroups1796153007781 implements MigrationInterface {
  name = 'NotebookStudiesGroups1796153007781';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "reference_group_versions" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "group_id" uuid NOT NULL, "number" integer NOT NULL, "dataset_version_id" uuid NOT NULL, "source" text NOT NULL, "member_ids" text array NOT NULL, "note" text NOT NULL DEFAULT '', "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "approved_at" TIMESTAMP WITH TIME ZONE, "approved_by" uuid, CONSTRAINT "reference_group_versions_group_number_key" UNIQUE ("group_id", "number"), CONSTRAINT "PK_bd16bb940b3553bb0d662ad3503" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "reference_groups" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "name" text NOT NULL, "description" text NOT NULL DEFAULT '', "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "reference_groups_lab_name_key" UNIQUE ("lab_id", "name"), CONSTRAINT "PK_cbc4910fe45e34d6d46140552cc" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "study_overrides" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "study_id" uuid NOT NULL, "run_id" uuid NOT NULL, "sample_id" text NOT NULL, "computed_verdict" text NOT NULL, "computed_group" text, "verdict" text NOT NULL, "group_name" text, "reason" text NOT NULL, "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "study_overrides_run_sample_key" UNIQUE ("study_id", "run_id", "sample_id"), CONSTRAINT "PK_4c17a3e86c338fc14f53e5451ff" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "study_steps" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "study_id" uuid NOT NULL, "key" text NOT NULL, "position" smallint NOT NULL, "status" text NOT NULL DEFAULT 'not_run', "parameters" jsonb, "run_id" uuid, "error" text, "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_by" uuid, CONSTRAINT "study_steps_study_key_key" UNIQUE ("study_id", "key"), CONSTRAINT "PK_767e0cf6301c53e3b81a5041bba" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "studies" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "name" text NOT NULL, "description" text NOT NULL DEFAULT '', "owner_id" uuid, "copied_from_id" uuid, "signed_off_at" TIMESTAMP WITH TIME ZONE, "signed_off_by" uuid, "sign_off_statement" text, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_b100ff0c4a0ad02a9c2270d45b6" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "studies_lab_updated_idx" ON "studies"("lab_id", "updated_at")`);
    await queryRunner.query(
      `ALTER TABLE "reference_group_versions" ADD CONSTRAINT "FK_fae705817e5a21b5d6ac1ab470c" FOREIGN KEY ("group_id") REFERENCES "reference_groups"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "reference_group_versions" ADD CONSTRAINT "FK_2c2c9bb3f362531e29aabafeddc" FOREIGN KEY ("created_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "reference_group_versions" ADD CONSTRAINT "FK_1386e1d8bcc70d08440bbd22965" FOREIGN KEY ("approved_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "reference_groups" ADD CONSTRAINT "FK_2ddc4b3fb28315a8a9f9451d29c" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "study_overrides" ADD CONSTRAINT "FK_ab5fb9f8292272e6959a7cc615f" FOREIGN KEY ("study_id") REFERENCES "studies"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "study_overrides" ADD CONSTRAINT "FK_80e8df7f4fa84a001a9816a8455" FOREIGN KEY ("created_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "study_steps" ADD CONSTRAINT "FK_ac80b74b3d4386c82b3640ba1ec" FOREIGN KEY ("study_id") REFERENCES "studies"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "study_steps" ADD CONSTRAINT "FK_56970805acf08a41dc50e487edd" FOREIGN KEY ("updated_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "studies" ADD CONSTRAINT "FK_077bc8b81b4eed2b52e6dffac2a" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "studies" ADD CONSTRAINT "FK_c65a4ef70069b2909b81ab652f3" FOREIGN KEY ("owner_id") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "studies" ADD CONSTRAINT "FK_de1129ad129f3304bf0069cb458" FOREIGN KEY ("signed_off_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "studies" DROP CONSTRAINT "FK_de1129ad129f3304bf0069cb458"`);
    await queryRunner.query(`ALTER TABLE "studies" DROP CONSTRAINT "FK_c65a4ef70069b2909b81ab652f3"`);
    await queryRunner.query(`ALTER TABLE "studies" DROP CONSTRAINT "FK_077bc8b81b4eed2b52e6dffac2a"`);
    await queryRunner.query(`ALTER TABLE "study_steps" DROP CONSTRAINT "FK_56970805acf08a41dc50e487edd"`);
    await queryRunner.query(`ALTER TABLE "study_steps" DROP CONSTRAINT "FK_ac80b74b3d4386c82b3640ba1ec"`);
    await queryRunner.query(`ALTER TABLE "study_overrides" DROP CONSTRAINT "FK_80e8df7f4fa84a001a9816a8455"`);
    await queryRunner.query(`ALTER TABLE "study_overrides" DROP CONSTRAINT "FK_ab5fb9f8292272e6959a7cc615f"`);
    await queryRunner.query(`ALTER TABLE "reference_groups" DROP CONSTRAINT "FK_2ddc4b3fb28315a8a9f9451d29c"`);
    await queryRunner.query(`ALTER TABLE "reference_group_versions" DROP CONSTRAINT "FK_1386e1d8bcc70d08440bbd22965"`);
    await queryRunner.query(`ALTER TABLE "reference_group_versions" DROP CONSTRAINT "FK_2c2c9bb3f362531e29aabafeddc"`);
    await queryRunner.query(`ALTER TABLE "reference_group_versions" DROP CONSTRAINT "FK_fae705817e5a21b5d6ac1ab470c"`);
    await queryRunner.query(`DROP INDEX "public"."studies_lab_updated_idx"`);
    await queryRunner.query(`DROP TABLE "studies"`);
    await queryRunner.query(`DROP TABLE "study_steps"`);
    await queryRunner.query(`DROP TABLE "study_overrides"`);
    await queryRunner.query(`DROP TABLE "reference_groups"`);
    await queryRunner.query(`DROP TABLE "reference_group_versions"`);
  }
}
