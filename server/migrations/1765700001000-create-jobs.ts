import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Scheduled work shared by every server process: claimed with SELECT … FOR UPDATE SKIP LOCKED, so two processes
 * never run the same job at the same time; `unique_key` makes enqueueing the same work twice a no-op.
 */
export class CreateJobs1765700001000 implements MigrationInterface {
  name = 'CreateJobs1765700001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE jobs (
        id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT,
        kind VARCHAR(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        unique_key VARCHAR(191) CHARACTER SET ascii COLLATE ascii_bin NULL,
        payload JSON NOT NULL,
        run_at DATETIME(3) NOT NULL,
        state ENUM('pending','running','done','failed','cancelled') NOT NULL DEFAULT 'pending',
        attempts INT UNSIGNED NOT NULL DEFAULT 0,
        max_attempts INT UNSIGNED NOT NULL DEFAULT 10,
        last_error TEXT NULL,
        locked_by VARCHAR(100) NULL,
        locked_at DATETIME(3) NULL,
        finished_at DATETIME(3) NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_jobs_unique_key (unique_key),
        KEY ix_jobs_due (state, run_at),
        KEY ix_jobs_kind (kind, state)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE jobs');
  }
}
