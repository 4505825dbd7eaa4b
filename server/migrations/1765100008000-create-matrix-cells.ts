import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateMatrixCells1765100008000 implements MigrationInterface {
  name = 'CreateMatrixCells1765100008000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE matrix_cells (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        roundup_entry_id INT UNSIGNED NOT NULL,
        load_configuration_id INT UNSIGNED NOT NULL,
        state ENUM('not-started','assigned','running','recorded','needs-retest','accepted') NOT NULL DEFAULT 'not-started',
        tester_id INT UNSIGNED NULL,
        due_date DATE NULL,
        note VARCHAR(500) NULL,
        assigned_at DATETIME(3) NULL,
        state_changed_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_matrix_cells_entry_config (roundup_entry_id, load_configuration_id),
        KEY ix_matrix_cells_tester_queue (tester_id, state, due_date),
        KEY ix_matrix_cells_roundup_state (roundup_id, state),
        KEY ix_matrix_cells_config (load_configuration_id),
        CONSTRAINT fk_matrix_cells_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id) ON DELETE CASCADE,
        CONSTRAINT fk_matrix_cells_entry FOREIGN KEY (roundup_entry_id) REFERENCES roundup_entries (id) ON DELETE CASCADE,
        CONSTRAINT fk_matrix_cells_load_configuration FOREIGN KEY (load_configuration_id) REFERENCES load_configurations (id),
        CONSTRAINT fk_matrix_cells_tester FOREIGN KEY (tester_id) REFERENCES users (id)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE matrix_cells');
  }
}
