import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateLoadConfigurations1765100004000 implements MigrationInterface {
  name = 'CreateLoadConfigurations1765100004000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE load_configurations (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        name VARCHAR(120) NOT NULL,
        cpu_description VARCHAR(200) NOT NULL,
        settings_mode VARCHAR(16) NOT NULL,
        fixed_clock_mhz SMALLINT UNSIGNED NULL,
        settings_notes VARCHAR(500) NULL,
        expected_package_power_w DECIMAL(5,1) NOT NULL COMMENT 'W',
        core_voltage_v DECIMAL(4,3) NOT NULL COMMENT 'V',
        soak_minutes SMALLINT UNSIGNED NOT NULL,
        archived_at DATETIME(3) NULL,
        created_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_load_configurations_name (name),
        CONSTRAINT fk_load_configurations_created_by FOREIGN KEY (created_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE load_configurations');
  }
}
