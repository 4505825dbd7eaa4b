import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Counters of wrong passwords per account and per client address, shared by every app server. */
export class CreatePasswordGuessCounters1765300001000 implements MigrationInterface {
  name = 'CreatePasswordGuessCounters1765300001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE password_guess_counters (
        counter_key CHAR(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        kind ENUM('account','address') NOT NULL,
        failures INT UNSIGNED NOT NULL DEFAULT 0,
        window_started_at DATETIME(3) NOT NULL,
        locked_until DATETIME(3) NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (counter_key),
        KEY ix_password_guess_counters_updated (updated_at)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE password_guess_counters');
  }
}
