import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Every uploaded file kept as evidence (logger files; photo originals are not kept, only their web sizes). */
export class CreateStoredFiles1765200001000 implements MigrationInterface {
  name = 'CreateStoredFiles1765200001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE stored_files (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        storage_key VARCHAR(512) NOT NULL,
        sha256 CHAR(64) NOT NULL,
        byte_size BIGINT UNSIGNED NOT NULL,
        content_type VARCHAR(100) NOT NULL,
        original_name VARCHAR(255) NOT NULL,
        uploaded_by INT UNSIGNED NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_stored_files_key (storage_key),
        KEY ix_stored_files_sha256 (sha256),
        CONSTRAINT fk_stored_files_uploader FOREIGN KEY (uploaded_by) REFERENCES users (id)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE stored_files');
  }
}
