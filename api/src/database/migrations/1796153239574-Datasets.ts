import { MigrationInterface, QueryRunner } from 'typeorm';

export class Datasets1796153239574 implements MigrationInterface {
  name = 'Datasets1796153239574';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "dataset_files" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "filename" text NOT NULL, "format" text NOT NULL, "size_bytes" integer NOT NULL, "sha256" text NOT NULL, "content" bytea NOT NULL, "uploaded_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_94d03b158f6546a0c529da9d0b3" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "dataset_files_lab_idx" ON "dataset_files"  ("lab_id", "created_at") `);
    await queryRunner.query(
      `CREATE TABLE "dataset_problems" ("version_id" uuid NOT NULL, "position" integer NOT NULL, "source_row" integer, "column_name" text, "raw" text, "code" text NOT NULL, "message" text NOT NULL, "action" text NOT NULL, CONSTRAINT "PK_c1a8c3e06af00001b0825118d5c" PRIMARY KEY ("version_id", "position"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "dataset_rows" ("version_id" uuid NOT NULL, "position" integer NOT NULL, "source_row" integer NOT NULL, "sample_id" text NOT NULL, "group_name" text, "ppm" double precision array NOT NULL, "original" double precision array NOT NULL, "flags" smallint array NOT NULL, "raw" text array NOT NULL, "attributes" jsonb, CONSTRAINT "PK_d47fd3e3220b54636b46598c295" PRIMARY KEY ("version_id", "position"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "dataset_versions" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "dataset_id" uuid NOT NULL, "lab_id" uuid NOT NULL, "number" integer NOT NULL, "note" text NOT NULL DEFAULT '', "file_id" uuid NOT NULL, "mapping" jsonb NOT NULL, "columns" jsonb NOT NULL, "summary" jsonb NOT NULL, "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "dataset_versions_dataset_number_key" UNIQUE ("dataset_id", "number"), CONSTRAINT "PK_2335c164f3df47dabfe7d0fc6e5" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "datasets" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "name" text NOT NULL, "kind" text NOT NULL, "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "PK_1bf831e43c559a240303e23d038" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "datasets_lab_idx" ON "datasets"  ("lab_id", "created_at") `);
    await queryRunner.query(
      `CREATE TABLE "dataset_saved_mappings" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "fingerprint" text NOT NULL, "mapping" jsonb NOT NULL, "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), CONSTRAINT "dataset_saved_mappings_lab_fingerprint_key" UNIQUE ("lab_id", "fingerprint"), CONSTRAINT "PK_343f5c4cf8794a2178cd7e72015" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(
      `ALTER TABLE "dataset_files" ADD CONSTRAINT "FK_af5ceb00fdcb771bb5fde22c80a" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "dataset_problems" ADD CONSTRAINT "FK_cb7f280d96acc928d602c3cc9d0" FOREIGN KEY ("version_id") REFERENCES "dataset_versions"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "dataset_rows" ADD CONSTRAINT "FK_9771bc2d0cabdf8d0f241bec4c0" FOREIGN KEY ("version_id") REFERENCES "dataset_versions"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "dataset_versions" ADD CONSTRAINT "FK_59250594d45b0202fdc42d55ecc" FOREIGN KEY ("dataset_id") REFERENCES "datasets"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "dataset_versions" ADD CONSTRAINT "FK_c7a62bf1a920b6c3d8b15081873" FOREIGN KEY ("file_id") REFERENCES "dataset_files"("id") ON DELETE NO ACTION ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "datasets" ADD CONSTRAINT "FK_b35ba94b0a892a7f615bdc428de" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "dataset_saved_mappings" ADD CONSTRAINT "FK_8f1afddd17c1bde72a23d891a98" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "dataset_saved_mappings" DROP CONSTRAINT "FK_8f1afddd17c1bde72a23d891a98"`);
    await queryRunner.query(`ALTER TABLE "datasets" DROP CONSTRAINT "FK_b35ba94b0a892a7f615bdc428de"`);
    await queryRunner.query(`ALTER TABLE "dataset_versions" DROP CONSTRAINT "FK_c7a62bf1a920b6c3d8b15081873"`);
    await queryRunner.query(`ALTER TABLE "dataset_versions" DROP CONSTRAINT "FK_59250594d45b0202fdc42d55ecc"`);
    await queryRunner.query(`ALTER TABLE "dataset_rows" DROP CONSTRAINT "FK_9771bc2d0cabdf8d0f241bec4c0"`);
    await queryRunner.query(`ALTER TABLE "dataset_problems" DROP CONSTRAINT "FK_cb7f280d96acc928d602c3cc9d0"`);
    await queryRunner.query(`ALTER TABLE "dataset_files" DROP CONSTRAINT "FK_af5ceb00fdcb771bb5fde22c80a"`);
    await queryRunner.query(`DROP TABLE "dataset_saved_mappings"`);
    await queryRunner.query(`DROP INDEX "public"."datasets_lab_idx"`);
    await queryRunner.query(`DROP TABLE "datasets"`);
    await queryRunner.query(`DROP TABLE "dataset_versions"`);
    await queryRunner.query(`DROP TABLE "dataset_rows"`);
    await queryRunner.query(`DROP TABLE "dataset_problems"`);
    await queryRunner.query(`DROP INDEX "public"."dataset_files_lab_idx"`);
    await queryRunner.query(`DROP TABLE "dataset_files"`);
  }
}
