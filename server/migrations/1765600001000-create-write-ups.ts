import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A roundup's write-up: its sections (introduction, how we tested, one per tested product, conclusion) stored as
 * editor JSON with a version for optimistic saving and a review state; every saved version as a revision; comment
 * threads on a section.
 */
export class CreateWriteUps1765600001000 implements MigrationInterface {
  name = 'CreateWriteUps1765600001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE write_up_sections (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        kind ENUM('introduction','methodology','product','conclusion') NOT NULL,
        roundup_entry_id INT UNSIGNED NULL,
        section_key VARCHAR(40) NOT NULL,
        position SMALLINT UNSIGNED NOT NULL,
        title VARCHAR(200) NOT NULL,
        content JSON NOT NULL,
        version INT UNSIGNED NOT NULL DEFAULT 1,
        review_state ENUM('drafting','with-editor','signed-off') NOT NULL DEFAULT 'drafting',
        review_state_changed_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        review_state_changed_by INT UNSIGNED NULL,
        updated_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_write_up_sections_key (roundup_id, section_key),
        KEY ix_write_up_sections_roundup (roundup_id, position),
        CONSTRAINT fk_write_up_sections_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id),
        CONSTRAINT fk_write_up_sections_entry FOREIGN KEY (roundup_entry_id) REFERENCES roundup_entries (id),
        CONSTRAINT fk_write_up_sections_state_by FOREIGN KEY (review_state_changed_by) REFERENCES users (id),
        CONSTRAINT fk_write_up_sections_updated_by FOREIGN KEY (updated_by) REFERENCES users (id),
        CONSTRAINT ck_write_up_sections_content CHECK (JSON_VALID(content))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE write_up_revisions (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        section_id INT UNSIGNED NOT NULL,
        kind ENUM('prefill','save','restore','refused-copy') NOT NULL,
        version INT UNSIGNED NULL,
        based_on_version INT UNSIGNED NULL,
        restored_from_id INT UNSIGNED NULL,
        title VARCHAR(200) NOT NULL,
        content JSON NOT NULL,
        author_id INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_write_up_revisions_section (section_id, id),
        CONSTRAINT fk_write_up_revisions_section FOREIGN KEY (section_id) REFERENCES write_up_sections (id),
        CONSTRAINT fk_write_up_revisions_author FOREIGN KEY (author_id) REFERENCES users (id),
        CONSTRAINT ck_write_up_revisions_content CHECK (JSON_VALID(content))
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE write_up_comments (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        section_id INT UNSIGNED NOT NULL,
        parent_id INT UNSIGNED NULL,
        author_id INT UNSIGNED NOT NULL,
        body TEXT NOT NULL,
        resolved_at DATETIME(3) NULL,
        resolved_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_write_up_comments_section (section_id, parent_id, id),
        CONSTRAINT fk_write_up_comments_section FOREIGN KEY (section_id) REFERENCES write_up_sections (id),
        CONSTRAINT fk_write_up_comments_parent FOREIGN KEY (parent_id) REFERENCES write_up_comments (id),
        CONSTRAINT fk_write_up_comments_author FOREIGN KEY (author_id) REFERENCES users (id),
        CONSTRAINT fk_write_up_comments_resolved_by FOREIGN KEY (resolved_by) REFERENCES users (id)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE write_up_comments');
    await queryRunner.query('DROP TABLE write_up_revisions');
    await queryRunner.query('DROP TABLE write_up_sections');
  }
}
