import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Photos of a product within a roundup, in the order the editor set, with their web sizes in the file store. */
export class CreatePhotos1765200004000 implements MigrationInterface {
  name = 'CreatePhotos1765200004000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE photos (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        roundup_entry_id INT UNSIGNED NOT NULL,
        kind ENUM('overview','power-delivery','heatsinks','thermal-image','other') NOT NULL,
        caption VARCHAR(300) NOT NULL DEFAULT '',
        alt_text VARCHAR(300) NOT NULL,
        position INT UNSIGNED NOT NULL,
        width INT UNSIGNED NOT NULL,
        height INT UNSIGNED NOT NULL,
        source_sha256 CHAR(64) NOT NULL,
        derivatives JSON NOT NULL,
        uploaded_by INT UNSIGNED NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_photos_entry (roundup_entry_id, position),
        KEY ix_photos_roundup (roundup_id),
        CONSTRAINT fk_photos_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_photos_entry FOREIGN KEY (roundup_entry_id) REFERENCES roundup_entries (id),
        CONSTRAINT fk_photos_uploader FOREIGN KEY (uploaded_by) REFERENCES users (id),
        CONSTRAINT ck_photos_derivatives CHECK (JSON_VALID(derivatives))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE photos');
  }
}
