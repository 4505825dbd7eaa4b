import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The column mapping remembered per bench profile (the next upload on that profile is mapped already) and the
 * verdict rubric an editor may adjust per roundup (NULL: the engine's defaults).
 */
export class CaptureSettings1765200005000 implements MigrationInterface {
  name = 'CaptureSettings1765200005000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      ALTER TABLE bench_profiles
        ADD COLUMN log_mapping JSON NULL,
        ADD CONSTRAINT ck_bench_profiles_log_mapping CHECK (log_mapping IS NULL OR JSON_VALID(log_mapping))`);
    await queryRunner.query(`
      ALTER TABLE roundups
        ADD COLUMN verdict_rubric JSON NULL,
        ADD CONSTRAINT ck_roundups_verdict_rubric CHECK (verdict_rubric IS NULL OR JSON_VALID(verdict_rubric))`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(
      'ALTER TABLE roundups DROP CONSTRAINT ck_roundups_verdict_rubric, DROP COLUMN verdict_rubric',
    );
    await queryRunner.query(
      'ALTER TABLE bench_profiles DROP CONSTRAINT ck_bench_profiles_log_mapping, DROP COLUMN log_mapping',
    );
  }
}
