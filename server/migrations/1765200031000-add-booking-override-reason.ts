import type { MigrationInterface, QueryRunner } from 'typeorm';

/** A booking made although the bench's set-up differs from a roundup's bench profile keeps the tester's reason. */
export class AddBookingOverrideReason1765200031000 implements MigrationInterface {
  name = 'AddBookingOverrideReason1765200031000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE bench_bookings ADD COLUMN override_reason VARCHAR(300) NULL AFTER note');
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE bench_bookings DROP COLUMN override_reason');
  }
}
