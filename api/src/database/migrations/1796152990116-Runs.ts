import { MigrationInterface, QueryRunner } from 'typeorm';

export class Runs1796152990116 implements MigrationInterface {
  name = 'Runs1796152990116';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "run_assignments" ("run_id" uuid NOT NULL, "ordinal" integer NOT NULL, "sample_id" text NOT NULL, "verdict" text NOT NULL, "group_name" text NOT NULL, "probability" double precision NOT NULL, "runner_up" text, "runner_up_probability" double precision, "d2" double precision array NOT NULL, "p_chi2" double precision array NOT NULL, "p_hotelling" double precision array NOT NULL, "contributions" double precision array NOT NULL, CONSTRAINT "PK_090a8e9fb90defba80c55aeae42" PRIMARY KEY ("run_id", "ordinal"))`,
    );
    await queryRunner.query(`CREATE INDEX "run_assignments_sample_idx" ON "run_assignments"  ("run_id", "sample_id") `);
    await queryRunner.query(
      `CREATE INDEX "run_assignments_group_idx" ON "run_assignments"  ("run_id", "group_name", "probability", "ordinal") `,
    );
    await queryRunner.query(
      `CREATE INDEX "run_assignments_verdict_idx" ON "run_assignments"  ("run_id", "verdict", "probability", "ordinal") `,
    );
    await queryRunner.query(
      `CREATE INDEX "run_assignments_runner_up_idx" ON "run_assignments"  ("run_id", "runner_up_probability", "ordinal") `,
    );
    await queryRunner.query(
      `CREATE INDEX "run_assignments_probability_idx" ON "run_assignments"  ("run_id", "probability", "ordinal") `,
    );
    await queryRunner.query(
      `CREATE TABLE "run_check_members" ("run_id" uuid NOT NULL, "ordinal" integer NOT NULL, "sample_id" text NOT NULL, "group_name" text NOT NULL, "d2" double precision NOT NULL, "d2_loo" double precision NOT NULL, "p_chi2_loo" double precision NOT NULL, "p_hotelling_loo" double precision NOT NULL, "outcome" text NOT NULL, "best_group" text NOT NULL, CONSTRAINT "PK_81b4afd140dccd994096ec26f44" PRIMARY KEY ("run_id", "ordinal"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "run_check_pairs" ("run_id" uuid NOT NULL, "group_a" text NOT NULL, "group_b" text NOT NULL, "t2" double precision NOT NULL, "f" double precision NOT NULL, "df1" integer NOT NULL, "df2" integer NOT NULL, "p" double precision NOT NULL, CONSTRAINT "PK_b5e1a49c77786cf5207e5ca48de" PRIMARY KEY ("run_id", "group_a", "group_b"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "run_groups" ("run_id" uuid NOT NULL, "group_index" integer NOT NULL, "name" text NOT NULL, "n" integer NOT NULL, "effective_n" integer NOT NULL, "variables" text array NOT NULL, CONSTRAINT "PK_f96197820b69e33e8ff48be83fc" PRIMARY KEY ("run_id", "group_index"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "run_inputs" ("run_id" uuid NOT NULL, "role" text NOT NULL, "ordinal" integer NOT NULL, "sample_id" text NOT NULL, "group_label" text, "values" double precision array NOT NULL, "below_detection" boolean array NOT NULL, CONSTRAINT "PK_df106c423b6c50bef38e0e03455" PRIMARY KEY ("run_id", "role", "ordinal"))`,
    );
    await queryRunner.query(
      `CREATE TABLE "runs" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "study_id" uuid, "kind" text NOT NULL, "status" text NOT NULL DEFAULT 'queued', "progress" double precision NOT NULL DEFAULT '0', "phase" text NOT NULL DEFAULT 'waiting for a worker', "error" text, "parameters" jsonb NOT NULL, "seed" integer, "attempt" integer NOT NULL DEFAULT '0', "summary" jsonb, "created_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "updated_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "started_at" TIMESTAMP WITH TIME ZONE, "finished_at" TIMESTAMP WITH TIME ZONE, CONSTRAINT "PK_46d6a1e257c38ba58f1a3c30836" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "runs_lab_created_idx" ON "runs"  ("lab_id", "created_at") `);
    await queryRunner.query(
      `ALTER TABLE "run_assignments" ADD CONSTRAINT "FK_486547e85e9d8c6292b70f68745" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "run_check_members" ADD CONSTRAINT "FK_0adfae5e490f5eb23f569808edb" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "run_check_pairs" ADD CONSTRAINT "FK_f12ddf6c24e105317ade47ffb0d" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "run_groups" ADD CONSTRAINT "FK_b35d22c3a4dd519cd6f1bea47f4" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "run_inputs" ADD CONSTRAINT "FK_67c6817a75fefa70ab3dda35ad7" FOREIGN KEY ("run_id") REFERENCES "runs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "runs" ADD CONSTRAINT "FK_bf0c8f76175449f762fd79e5e85" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "runs" ADD CONSTRAINT "FK_e795f2334dd9cb80695c08730fd" FOREIGN KEY ("created_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "runs" DROP CONSTRAINT "FK_e795f2334dd9cb80695c08730fd"`);
    await queryRunner.query(`ALTER TABLE "runs" DROP CONSTRAINT "FK_bf0c8f76175449f762fd79e5e85"`);
    await queryRunner.query(`ALTER TABLE "run_inputs" DROP CONSTRAINT "FK_67c6817a75fefa70ab3dda35ad7"`);
    await queryRunner.query(`ALTER TABLE "run_groups" DROP CONSTRAINT "FK_b35d22c3a4dd519cd6f1bea47f4"`);
    await queryRunner.query(`ALTER TABLE "run_check_pairs" DROP CONSTRAINT "FK_f12ddf6c24e105317ade47ffb0d"`);
    await queryRunner.query(`ALTER TABLE "run_check_members" DROP CONSTRAINT "FK_0adfae5e490f5eb23f569808edb"`);
    await queryRunner.query(`ALTER TABLE "run_assignments" DROP CONSTRAINT "FK_486547e85e9d8c6292b70f68745"`);
    await queryRunner.query(`DROP INDEX "public"."runs_lab_created_idx"`);
    await queryRunner.query(`DROP TABLE "runs"`);
    await queryRunner.query(`DROP TABLE "run_inputs"`);
    await queryRunner.query(`DROP TABLE "run_groups"`);
    await queryRunner.query(`DROP TABLE "run_check_pairs"`);
    await queryRunner.query(`DROP TABLE "run_check_members"`);
    await queryRunner.query(`DROP INDEX "public"."run_assignments_probability_idx"`);
    await queryRunner.query(`DROP INDEX "public"."run_assignments_runner_up_idx"`);
    await queryRunner.query(`DROP INDEX "public"."run_assignments_verdict_idx"`);
    await queryRunner.query(`DROP INDEX "public"."run_assignments_group_idx"`);
    await queryRunner.query(`DROP INDEX "public"."run_assignments_sample_idx"`);
    await queryRunner.query(`DROP TABLE "run_assignments"`);
  }
}
