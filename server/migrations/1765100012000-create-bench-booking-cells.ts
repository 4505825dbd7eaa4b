import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateBenchBookingCells1765100012000 implements MigrationInterface {
  name = 'CreateBenchBookingCells1765100012000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE bench_booking_cells (
        booking_id INT UNSIGNED NOT NULL,
        matrix_cell_id INT UNSIGNED NOT NULL,
        PRIMARY KEY (booking_id, matrix_cell_id),
        KEY ix_bench_booking_cells_cell (matrix_cell_id),
        CONSTRAINT fk_bbc_booking FOREIGN KEY (booking_id) REFERENCES bench_bookings (id) ON DELETE CASCADE,
        CONSTRAINT fk_bbc_cell FOREIGN KEY (matrix_cell_id) REFERENCES matrix_cells (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE bench_booking_cells');
  }
}
