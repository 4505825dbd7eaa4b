import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The editor's verdicts per product, the charts of a roundup (settings and the approved snapshot with its image), and
 * matrix cells left out of a roundup with a reason.
 */
export class CreateVerdictsChartsExclusions1765610001000 implements MigrationInterface {
  name = 'CreateVerdictsChartsExclusions1765610001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE editorial_verdicts (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        roundup_entry_id INT UNSIGNED NOT NULL,
        label ENUM('bench-pick','recommended','fine-at-stock','skip-for-overclocking') NOT NULL,
        best_for VARCHAR(160) NOT NULL,
        price_minor INT UNSIGNED NOT NULL,
        price_currency CHAR(3) NOT NULL,
        reason TEXT NULL,
        contradictions JSON NULL,
        updated_by INT UNSIGNED NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_editorial_verdicts_entry (roundup_entry_id),
        KEY ix_editorial_verdicts_roundup (roundup_id),
        CONSTRAINT fk_editorial_verdicts_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_editorial_verdicts_entry FOREIGN KEY (roundup_entry_id) REFERENCES roundup_entries (id) ON DELETE CASCADE,
        CONSTRAINT fk_editorial_verdicts_user FOREIGN KEY (updated_by) REFERENCES users (id),
        CONSTRAINT ck_editorial_verdicts_contradictions CHECK (contradictions IS NULL OR JSON_VALID(contradictions))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE roundup_charts (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        chart_key VARCHAR(40) NOT NULL,
        settings JSON NOT NULL,
        approved_snapshot JSON NULL,
        approved_hash CHAR(64) NULL,
        approved_by INT UNSIGNED NULL,
        approved_at DATETIME(3) NULL,
        image_file_id INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_roundup_charts_key (roundup_id, chart_key),
        CONSTRAINT fk_roundup_charts_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_roundup_charts_approver FOREIGN KEY (approved_by) REFERENCES users (id),
        CONSTRAINT fk_roundup_charts_image FOREIGN KEY (image_file_id) REFERENCES stored_files (id),
        CONSTRAINT ck_roundup_charts_settings CHECK (JSON_VALID(settings)),
        CONSTRAINT ck_roundup_charts_snapshot CHECK (approved_snapshot IS NULL OR JSON_VALID(approved_snapshot))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE matrix_cell_exclusions (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        matrix_cell_id INT UNSIGNED NOT NULL,
        reason TEXT NOT NULL,
        excluded_by INT UNSIGNED NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_matrix_cell_exclusions_cell (matrix_cell_id),
        KEY ix_matrix_cell_exclusions_roundup (roundup_id),
        CONSTRAINT fk_matrix_cell_exclusions_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_matrix_cell_exclusions_cell FOREIGN KEY (matrix_cell_id) REFERENCES matrix_cells (id) ON DELETE CASCADE,
        CONSTRAINT fk_matrix_cell_exclusions_user FOREIGN KEY (excluded_by) REFERENCES users (id)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE matrix_cell_exclusions');
    await queryRunner.query('DROP TABLE roundup_charts');
    await queryRunner.query('DROP TABLE editorial_verdicts');
  }
}
