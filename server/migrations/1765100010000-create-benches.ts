import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateBenches1765100010000 implements MigrationInterface {
  name = 'CreateBenches1765100010000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE benches (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        name VARCHAR(80) NOT NULL,
        location VARCHAR(120) NULL,
        bench_profile_id INT UNSIGNED NULL,
        notes VARCHAR(500) NULL,
        active TINYINT(1) NOT NULL DEFAULT 1,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_benches_name (name),
        CONSTRAINT fk_benches_bench_profile FOREIGN KEY (bench_profile_id) REFERENCES bench_profiles (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE benches');
  }
}
