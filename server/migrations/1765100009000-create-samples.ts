import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateSamples1765100009000 implements MigrationInterface {
  name = 'CreateSamples1765100009000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE samples (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_entry_id INT UNSIGNED NOT NULL,
        source ENUM('retail','vendor-loan') NULL,
        order_reference VARCHAR(120) NULL,
        cost_minor INT UNSIGNED NULL COMMENT 'integer minor units of cost_currency',
        cost_currency CHAR(3) NULL,
        vendor_contact VARCHAR(200) NULL,
        return_by DATE NULL COMMENT 'calendar date in the roundup time zone',
        received_on DATE NULL,
        returned_on DATE NULL,
        serial_number VARCHAR(80) NULL,
        condition_notes VARCHAR(1000) NULL,
        firmware_on_arrival VARCHAR(80) NULL,
        status ENUM('ordered','received','on-the-bench','tested','returned','kept') NOT NULL DEFAULT 'ordered',
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_samples_entry (roundup_entry_id),
        KEY ix_samples_loans (source, status, return_by),
        CONSTRAINT fk_samples_entry FOREIGN KEY (roundup_entry_id) REFERENCES roundup_entries (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE samples');
  }
}
