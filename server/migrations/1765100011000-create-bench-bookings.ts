import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateBenchBookings1765100011000 implements MigrationInterface {
  name = 'CreateBenchBookings1765100011000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE bench_bookings (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        bench_id INT UNSIGNED NOT NULL,
        tester_id INT UNSIGNED NOT NULL,
        starts_at DATETIME(3) NOT NULL COMMENT 'UTC, inclusive',
        ends_at DATETIME(3) NOT NULL COMMENT 'UTC, exclusive',
        note VARCHAR(300) NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_bench_bookings_calendar (bench_id, starts_at, ends_at),
        KEY ix_bench_bookings_tester (tester_id, starts_at),
        CONSTRAINT ck_bench_bookings_order CHECK (ends_at > starts_at),
        CONSTRAINT fk_bench_bookings_bench FOREIGN KEY (bench_id) REFERENCES benches (id),
        CONSTRAINT fk_bench_bookings_tester FOREIGN KEY (tester_id) REFERENCES users (id)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE bench_bookings');
  }
}
