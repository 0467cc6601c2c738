import { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each group-check member keeps its robust D² (FAST-MCD) and whether it exceeds χ²_p(0.975). Both are
 * nullable: runs made before this column, and groups too small for the fit, have none.
 */
export class CheckMemberRobustFit1796180000000 implements MigrationInterface {
  name = 'CheckMemberRobustFit1796180000000';

  public async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "run_check_members" ADD "robust_d2" double precision`);
    await queryRunner.query(`ALTER TABLE "run_check_members" ADD "robust_outlier" boolean`);
  }

  public async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE "run_check_members" DROP COLUMN "robust_outlier"`);
    await queryRunner.query(`ALTER TABLE "run_check_members" DROP COLUMN "robust_d2"`);
  }
}
