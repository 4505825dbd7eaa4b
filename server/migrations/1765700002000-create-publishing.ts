import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Embargo publishing: a roundup's schedule (the instant and the local date, time and zone the editor chose), its
 * publications (the first one and each dated update or correction, with the frozen published data; one row per
 * version, so publishing twice is a no-op), the rendered public pages served from memory, and server secrets
 * (the preview-link key) shared by every process.
 */
export class CreatePublishing1765700002000 implements MigrationInterface {
  name = 'CreatePublishing1765700002000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE roundup_schedules (
        roundup_id INT UNSIGNED NOT NULL,
        publish_at DATETIME(3) NOT NULL,
        local_date DATE NOT NULL,
        local_time VARCHAR(8) CHARACTER SET ascii NOT NULL,
        time_zone VARCHAR(64) NOT NULL,
        scheduled_by INT UNSIGNED NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (roundup_id),
        CONSTRAINT fk_roundup_schedules_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id) ON DELETE CASCADE,
        CONSTRAINT fk_roundup_schedules_user FOREIGN KEY (scheduled_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE roundup_publications (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        version INT UNSIGNED NOT NULL,
        kind ENUM('publication','update','correction') NOT NULL,
        note TEXT NULL,
        published_at DATETIME(3) NOT NULL,
        published_by INT UNSIGNED NULL,
        model JSON NOT NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_roundup_publications_version (roundup_id, version),
        CONSTRAINT fk_roundup_publications_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_roundup_publications_user FOREIGN KEY (published_by) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE published_pages (
        path VARCHAR(400) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        variant VARCHAR(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL DEFAULT '',
        roundup_id INT UNSIGNED NULL,
        content_type VARCHAR(100) CHARACTER SET ascii NOT NULL,
        etag VARCHAR(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        body MEDIUMBLOB NOT NULL,
        body_gzip MEDIUMBLOB NOT NULL,
        body_brotli MEDIUMBLOB NOT NULL,
        updated_at DATETIME(3) NOT NULL,
        PRIMARY KEY (path, variant),
        KEY ix_published_pages_updated (updated_at)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE server_secrets (
        name VARCHAR(64) CHARACTER SET ascii NOT NULL,
        secret VARBINARY(64) NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (name)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE server_secrets');
    await queryRunner.query('DROP TABLE published_pages');
    await queryRunner.query('DROP TABLE roundup_publications');
    await queryRunner.query('DROP TABLE roundup_schedules');
  }
}
