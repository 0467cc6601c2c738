import { MigrationInterface, QueryRunner } from 'typeorm';

export class InvitationsMailTokens1796153022004 implements MigrationInterface {
  name = 'InvitationsMailTokens1796153022004';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      `CREATE TABLE "mail_tokens" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "purpose" text NOT NULL, "email" text NOT NULL, "token_hash" text NOT NULL, "payload" jsonb NOT NULL DEFAULT '{}', "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL, "used_at" TIMESTAMP WITH TIME ZONE, CONSTRAINT "PK_a8dce7851dc8fe06772a6a13219" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE INDEX "mail_tokens_email_idx" ON "mail_tokens" ("email") `);
    await queryRunner.query(`CREATE UNIQUE INDEX "mail_tokens_token_hash_key" ON "mail_tokens" ("token_hash") `);
    await queryRunner.query(
      `CREATE TABLE "invitations" ("id" uuid NOT NULL DEFAULT gen_random_uuid(), "lab_id" uuid NOT NULL, "email" text NOT NULL, "role" text NOT NULL, "token_hash" text NOT NULL, "invited_by" uuid, "created_at" TIMESTAMP WITH TIME ZONE NOT NULL DEFAULT now(), "sent_at" TIMESTAMP WITH TIME ZONE NOT NULL, "expires_at" TIMESTAMP WITH TIME ZONE NOT NULL, "accepted_at" TIMESTAMP WITH TIME ZONE, "revoked_at" TIMESTAMP WITH TIME ZONE, CONSTRAINT "PK_5dec98cfdfd562e4ad3648bbb07" PRIMARY KEY ("id"))`,
    );
    await queryRunner.query(`CREATE UNIQUE INDEX "invitations_token_hash_key" ON "invitations" ("token_hash") `);
    await queryRunner.query(`CREATE INDEX "invitations_lab_email_idx" ON "invitations" ("lab_id", "email") `);
    await queryRunner.query(
      `ALTER TABLE "invitations" ADD CONSTRAINT "FK_1ef1969b2151e31fe25d8ee9286" FOREIGN KEY ("lab_id") REFERENCES "labs"("id") ON DELETE CASCADE ON UPDATE NO ACTION`,
    );
    await queryRunner.query(
      `ALTER TABLE "invitations" ADD CONSTRAINT "FK_29b1cef6891d9b9d4e35f793b81" FOREIGN KEY ("invited_by") REFERENCES "users"("id") ON DELETE SET NULL ON UPDATE NO ACTION`,
    );
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "invitations" DROP CONSTRAINT "FK_29b1cef6891d9b9d4e35f793b81"`);
    await queryRunner.query(`ALTER TABLE "invitations" DROP CONSTRAINT "FK_1ef1969b2151e31fe25d8ee9286"`);
    await queryRunner.query(`DROP INDEX "public"."invitations_lab_email_idx"`);
    await queryRunner.query(`DROP INDEX "public"."invitations_token_hash_key"`);
    await queryRunner.query(`DROP TABLE "invitations"`);
    await queryRunner.query(`DROP INDEX "public"."mail_tokens_token_hash_key"`);
    await queryRunner.query(`DROP INDEX "public"."mail_tokens_email_idx"`);
    await queryRunner.query(`DROP TABLE "mail_tokens"`);
  }
}
