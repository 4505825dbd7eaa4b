import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A bench's probes and logger with their calibration, and its maintenance log. */
export class CreateBenchInstrumentsAndMaintenance1765400033000 implements MigrationInterface {
  name = 'CreateBenchInstrumentsAndMaintenance1765400033000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE bench_instruments (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        bench_id INT UNSIGNED NOT NULL,
        kind ENUM('probe','logger') NOT NULL,
        label VARCHAR(120) NOT NULL,
        model VARCHAR(120) NULL,
        serial_number VARCHAR(80) NULL,
        calibrated_on DATE NULL,
        calibration_interval_months TINYINT UNSIGNED NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_bench_instruments_bench (bench_id, kind),
        CONSTRAINT fk_bench_instruments_bench FOREIGN KEY (bench_id) REFERENCES benches (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE bench_maintenance_entries (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        bench_id INT UNSIGNED NOT NULL,
        done_on DATE NOT NULL,
        description VARCHAR(500) NOT NULL,
        recorded_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_bench_maintenance_bench (bench_id, done_on),
        CONSTRAINT fk_bench_maintenance_bench FOREIGN KEY (bench_id) REFERENCES benches (id) ON DELETE CASCADE,
        CONSTRAINT fk_bench_maintenance_user FOREIGN KEY (recorded_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE bench_maintenance_entries');
    await queryRunner.query('DROP TABLE bench_instruments');
  }
}
