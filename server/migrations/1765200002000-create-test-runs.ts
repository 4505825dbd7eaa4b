import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A test run on one matrix cell: who ran it, on which bench and firmware, from a logger file or entered by hand,
 * and how the editor reviewed it. Analyses live in run_analyses (never edited, only added).
 */
export class CreateTestRuns1765200002000 implements MigrationInterface {
  name = 'CreateTestRuns1765200002000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE test_runs (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        matrix_cell_id INT UNSIGNED NOT NULL,
        roundup_id INT UNSIGNED NOT NULL,
        tester_id INT UNSIGNED NOT NULL,
        bench_id INT UNSIGNED NULL,
        bench_booking_id INT UNSIGNED NULL,
        firmware_version VARCHAR(100) NOT NULL,
        started_at DATETIME(3) NOT NULL,
        notes TEXT NULL,
        source ENUM('logger','manual') NOT NULL,
        logger_file_id INT UNSIGNED NULL,
        manual_peak_c DECIMAL(5,1) NULL,
        manual_ambient_c DECIMAL(4,1) NULL,
        outside_booking_reason VARCHAR(500) NULL,
        review_state ENUM('pending','accepted','sent-back') NOT NULL DEFAULT 'pending',
        review_reason TEXT NULL,
        reviewed_by INT UNSIGNED NULL,
        reviewed_at DATETIME(3) NULL,
        submitted_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_test_runs_cell (matrix_cell_id, submitted_at),
        KEY ix_test_runs_roundup (roundup_id),
        KEY ix_test_runs_tester (tester_id),
        CONSTRAINT fk_test_runs_cell FOREIGN KEY (matrix_cell_id) REFERENCES matrix_cells (id),
        CONSTRAINT fk_test_runs_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_test_runs_tester FOREIGN KEY (tester_id) REFERENCES users (id),
        CONSTRAINT fk_test_runs_bench FOREIGN KEY (bench_id) REFERENCES benches (id),
        CONSTRAINT fk_test_runs_booking FOREIGN KEY (bench_booking_id) REFERENCES bench_bookings (id) ON DELETE SET NULL,
        CONSTRAINT fk_test_runs_logger_file FOREIGN KEY (logger_file_id) REFERENCES stored_files (id),
        CONSTRAINT fk_test_runs_reviewer FOREIGN KEY (reviewed_by) REFERENCES users (id),
        CONSTRAINT ck_test_runs_source CHECK (
          (source = 'logger' AND logger_file_id IS NOT NULL) OR
          (source = 'manual' AND manual_peak_c IS NOT NULL AND manual_ambient_c IS NOT NULL)
        )
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      ALTER TABLE matrix_cells
        ADD COLUMN run_of_record_id INT UNSIGNED NULL AFTER note,
        ADD CONSTRAINT fk_matrix_cells_run_of_record FOREIGN KEY (run_of_record_id) REFERENCES test_runs (id)`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE matrix_cells DROP FOREIGN KEY fk_matrix_cells_run_of_record');
    await queryRunner.query('ALTER TABLE matrix_cells DROP COLUMN run_of_record_id');
    await queryRunner.query('DROP TABLE test_runs');
  }
}
