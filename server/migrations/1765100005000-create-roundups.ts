import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateRoundups1765100005000 implements MigrationInterface {
  name = 'CreateRoundups1765100005000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE roundups (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        title VARCHAR(200) NOT NULL,
        category VARCHAR(32) NOT NULL,
        platform VARCHAR(80) NOT NULL,
        state ENUM('planning','on-the-bench','writing','in-review','scheduled','live','updated') NOT NULL DEFAULT 'planning',
        price_min_minor INT UNSIGNED NOT NULL COMMENT 'inclusive, minor units of currency',
        price_max_minor INT UNSIGNED NOT NULL COMMENT 'inclusive, minor units of currency',
        currency CHAR(3) NOT NULL,
        region VARCHAR(8) NOT NULL,
        target_publish_date DATE NULL,
        time_zone VARCHAR(64) NOT NULL DEFAULT 'UTC',
        bench_profile_id INT UNSIGNED NULL,
        created_by INT UNSIGNED NULL,
        state_changed_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_roundups_state (state),
        CONSTRAINT ck_roundups_band CHECK (price_min_minor <= price_max_minor),
        CONSTRAINT fk_roundups_bench_profile FOREIGN KEY (bench_profile_id) REFERENCES bench_profiles (id),
        CONSTRAINT fk_roundups_created_by FOREIGN KEY (created_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE roundups');
  }
}
