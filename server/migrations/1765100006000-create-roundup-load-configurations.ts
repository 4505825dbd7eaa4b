import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateRoundupLoadConfigurations1765100006000 implements MigrationInterface {
  name = 'CreateRoundupLoadConfigurations1765100006000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE roundup_load_configurations (
        roundup_id INT UNSIGNED NOT NULL,
        load_configuration_id INT UNSIGNED NOT NULL,
        position SMALLINT UNSIGNED NOT NULL,
        PRIMARY KEY (roundup_id, load_configuration_id),
        KEY ix_roundup_load_configurations_config (load_configuration_id),
        CONSTRAINT fk_rlc_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id) ON DELETE CASCADE,
        CONSTRAINT fk_rlc_load_configuration FOREIGN KEY (load_configuration_id) REFERENCES load_configurations (id)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE roundup_load_configurations');
  }
}
