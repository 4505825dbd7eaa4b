import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Each analysis of a run, kept beside the earlier ones: the engine version and every parameter it used (mapping,
 * options, rubric), the whole result, and the headline figures as columns for the matrix and charts.
 */
export class CreateRunAnalyses1765200003000 implements MigrationInterface {
  name = 'CreateRunAnalyses1765200003000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE run_analyses (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        test_run_id INT UNSIGNED NOT NULL,
        engine_version VARCHAR(40) NOT NULL,
        parameters JSON NOT NULL,
        result JSON NOT NULL,
        verdict VARCHAR(30) NULL,
        peak_c DECIMAL(6,2) NULL,
        ambient_c DECIMAL(5,2) NULL,
        delta_over_ambient_c DECIMAL(6,2) NULL,
        normalised_peak_c DECIMAL(6,2) NULL,
        throttled_s DECIMAL(9,1) NULL,
        flag_codes VARCHAR(500) NOT NULL DEFAULT '',
        created_by INT UNSIGNED NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_run_analyses_run (test_run_id, id),
        CONSTRAINT fk_run_analyses_run FOREIGN KEY (test_run_id) REFERENCES test_runs (id),
        CONSTRAINT fk_run_analyses_creator FOREIGN KEY (created_by) REFERENCES users (id),
        CONSTRAINT ck_run_analyses_parameters CHECK (JSON_VALID(parameters)),
        CONSTRAINT ck_run_analyses_result CHECK (JSON_VALID(result))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE run_analyses');
  }
}
