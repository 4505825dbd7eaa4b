import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateBenchProfiles1765100003000 implements MigrationInterface {
  name = 'CreateBenchProfiles1765100003000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE bench_profiles (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        name VARCHAR(120) NOT NULL,
        case_and_fans VARCHAR(300) NOT NULL,
        cooler VARCHAR(200) NOT NULL,
        psu VARCHAR(200) NOT NULL,
        memory VARCHAR(300) NOT NULL,
        room_temp_target_c DECIMAL(4,1) NOT NULL COMMENT 'degrees C',
        room_temp_tolerance_c DECIMAL(3,1) NOT NULL COMMENT 'plus/minus degrees C',
        probe_type VARCHAR(120) NOT NULL,
        probe_placement VARCHAR(300) NOT NULL,
        required_soak_minutes SMALLINT UNSIGNED NOT NULL,
        notes TEXT NULL,
        archived_at DATETIME(3) NULL,
        created_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_bench_profiles_name (name),
        CONSTRAINT fk_bench_profiles_created_by FOREIGN KEY (created_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE bench_profiles');
  }
}
