import type { MigrationInterface, QueryRunner } from 'typeorm';

/** One private calendar feed per person; only a hash of its secret token is stored. */
export class CreateCalendarFeeds1765200032000 implements MigrationInterface {
  name = 'CreateCalendarFeeds1765200032000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE calendar_feeds (
        user_id INT UNSIGNED NOT NULL,
        token_hash CHAR(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (user_id),
        UNIQUE KEY uq_calendar_feeds_token_hash (token_hash),
        CONSTRAINT fk_calendar_feeds_user FOREIGN KEY (user_id) REFERENCES users (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE calendar_feeds');
  }
}
