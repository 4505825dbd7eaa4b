import type { MigrationInterface, QueryRunner } from 'typeorm';

export class CreateUsersSessionsAudit1764600000000 implements MigrationInterface {
  name = 'CreateUsersSessionsAudit1764600000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE users (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        email VARCHAR(254) NOT NULL,
        display_name VARCHAR(120) NOT NULL,
        role ENUM('admin','editor','writer','tester') NOT NULL,
        password_hash VARCHAR(255) NOT NULL,
        active TINYINT(1) NOT NULL DEFAULT 1,
        last_sign_in_at DATETIME(3) NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_users_email (email)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE sessions (
        id VARCHAR(64) NOT NULL,
        user_id INT UNSIGNED NOT NULL,
        expires_at DATETIME(3) NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        user_agent VARCHAR(255) NULL,
        ip_address VARCHAR(64) NULL,
        PRIMARY KEY (id),
        KEY ix_sessions_user (user_id),
        KEY ix_sessions_expires (expires_at),
        CONSTRAINT fk_sessions_user FOREIGN KEY (user_id) REFERENCES users (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE audit_entries (
        id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT,
        actor_id INT UNSIGNED NULL,
        action VARCHAR(64) NOT NULL,
        subject_type VARCHAR(64) NOT NULL,
        subject_id VARCHAR(64) NULL,
        details JSON NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_audit_subject (subject_type, subject_id),
        KEY ix_audit_created (created_at),
        CONSTRAINT fk_audit_actor FOREIGN KEY (actor_id) REFERENCES users (id) ON DELETE SET NULL
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query('DROP TABLE audit_entries');
    await queryRunner.query('DROP TABLE sessions');
    await queryRunner.query('DROP TABLE users');
  }
}
