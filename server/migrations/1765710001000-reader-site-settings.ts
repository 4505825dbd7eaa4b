import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Reader-site settings: whether a roundup's open data offers its raw logger files (the editor's choice per roundup,
 * off until allowed), and the outlet's name, public address and the licence line printed with open data.
 */
export class ReaderSiteSettings1765710001000 implements MigrationInterface {
  name = 'ReaderSiteSettings1765710001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('ALTER TABLE roundups ADD COLUMN open_data_raw_files TINYINT(1) NOT NULL DEFAULT 0');
    await queryRunner.query(`
      CREATE TABLE reader_site_settings (
        id TINYINT UNSIGNED NOT NULL,
        outlet_name VARCHAR(120) NOT NULL,
        open_data_licence VARCHAR(300) NOT NULL,
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        CONSTRAINT ck_reader_site_settings_single CHECK (id = 1)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE reader_site_settings');
    await queryRunner.query('ALTER TABLE roundups DROP COLUMN open_data_raw_files');
  }
}
