import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateRoundupEntries1765100007000 implements MigrationInterface {
  name = 'CreateRoundupEntries1765100007000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE roundup_entries (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        product_id INT UNSIGNED NOT NULL,
        kind ENUM('tested','reference') NOT NULL,
        reference_roundup_id INT UNSIGNED NULL,
        position SMALLINT UNSIGNED NOT NULL,
        added_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_roundup_entries_product (roundup_id, product_id),
        KEY ix_roundup_entries_product (product_id),
        CONSTRAINT fk_roundup_entries_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id) ON DELETE CASCADE,
        -- No cascade: a product that is in a roundup cannot be deleted (archive it instead).
        CONSTRAINT fk_roundup_entries_product FOREIGN KEY (product_id) REFERENCES products (id),
        CONSTRAINT fk_roundup_entries_reference FOREIGN KEY (reference_roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_roundup_entries_added_by FOREIGN KEY (added_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE roundup_entries');
  }
}
