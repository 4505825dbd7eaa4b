import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * What the local development relay received: one row per distinct Message-ID (a message resent with the same id is
 * accepted and dropped), kept whole so the dev inbox can show it as a reader's program would.
 */
export class CreateRelayMessages1765800001000 implements MigrationInterface {
  name = 'CreateRelayMessages1765800001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE relay_messages (
        id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT,
        message_id VARCHAR(255) CHARACTER SET ascii COLLATE ascii_bin NULL,
        mail_from VARCHAR(320) NOT NULL,
        recipient VARCHAR(320) NOT NULL,
        recipients TEXT NOT NULL,
        subject VARCHAR(998) NOT NULL,
        size_bytes INT UNSIGNED NOT NULL,
        received_at DATETIME(3) NOT NULL,
        raw LONGBLOB NOT NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_relay_messages_message_id (message_id),
        KEY ix_relay_messages_recipient (recipient),
        KEY ix_relay_messages_received_at (received_at)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE relay_messages');
  }
}
