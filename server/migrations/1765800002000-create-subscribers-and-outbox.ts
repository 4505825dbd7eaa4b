import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Readers who asked for mail, the categories they chose, the salted hashes of addresses never to mail again, the
 * mailings, and the outbox every mail goes through (one row per recipient with a unique key, so a retry, a second
 * sender or a repeated job can never make a second copy).
 */
export class CreateSubscribersAndOutbox1765800002000 implements MigrationInterface {
  name = 'CreateSubscribersAndOutbox1765800002000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE app_secrets (
        name VARCHAR(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        value VARCHAR(128) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (name)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE mail_categories (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        name VARCHAR(80) NOT NULL,
        description VARCHAR(300) NULL,
        match_product_class VARCHAR(32) NULL,
        match_platform VARCHAR(80) NULL,
        position SMALLINT UNSIGNED NOT NULL DEFAULT 0,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_mail_categories_name (name)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    // A first subject, so the sign-up form has something to offer before editors add their own.
    await queryRunner.query(
      "INSERT INTO mail_categories (name, description, position) VALUES ('Every new roundup', 'One mail whenever a roundup goes live.', 0)",
    );
    await queryRunner.query(`
      CREATE TABLE subscribers (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        email VARCHAR(254) NOT NULL,
        status ENUM('pending','confirmed','unsubscribed') NOT NULL DEFAULT 'pending',
        confirm_token_hash CHAR(64) CHARACTER SET ascii COLLATE ascii_bin NULL,
        confirm_expires_at DATETIME(3) NULL,
        link_version INT UNSIGNED NOT NULL DEFAULT 1,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        confirmed_at DATETIME(3) NULL,
        unsubscribed_at DATETIME(3) NULL,
        updated_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3) ON UPDATE CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        UNIQUE KEY uq_subscribers_email (email),
        UNIQUE KEY uq_subscribers_confirm_token (confirm_token_hash),
        KEY ix_subscribers_status (status)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE subscriber_categories (
        subscriber_id INT UNSIGNED NOT NULL,
        category_id INT UNSIGNED NOT NULL,
        PRIMARY KEY (subscriber_id, category_id),
        KEY ix_subscriber_categories_category (category_id),
        CONSTRAINT fk_subscriber_categories_subscriber FOREIGN KEY (subscriber_id) REFERENCES subscribers (id) ON DELETE CASCADE,
        CONSTRAINT fk_subscriber_categories_category FOREIGN KEY (category_id) REFERENCES mail_categories (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE mail_suppressions (
        address_hash CHAR(64) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        reason ENUM('erased','bounced','complained') NOT NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (address_hash)
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE mailings (
        id INT UNSIGNED NOT NULL AUTO_INCREMENT,
        roundup_id INT UNSIGNED NOT NULL,
        kind ENUM('go-live','update','correction') NOT NULL,
        note VARCHAR(2000) NULL,
        created_by INT UNSIGNED NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        PRIMARY KEY (id),
        KEY ix_mailings_roundup (roundup_id),
        CONSTRAINT fk_mailings_roundup FOREIGN KEY (roundup_id) REFERENCES roundups (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE mail_outbox (
        id BIGINT UNSIGNED NOT NULL AUTO_INCREMENT,
        idempotency_key VARCHAR(191) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        kind VARCHAR(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        mailing_id INT UNSIGNED NULL,
        subscriber_id INT UNSIGNED NULL,
        user_id INT UNSIGNED NULL,
        recipient VARCHAR(254) NULL,
        state ENUM('queued','sending','sent','deferred','failed','suppressed') NOT NULL DEFAULT 'queued',
        attempts SMALLINT UNSIGNED NOT NULL DEFAULT 0,
        next_attempt_at DATETIME(3) NOT NULL,
        lease_until DATETIME(3) NULL,
        payload JSON NULL,
        last_error VARCHAR(500) NULL,
        created_at DATETIME(3) NOT NULL DEFAULT CURRENT_TIMESTAMP(3),
        sent_at DATETIME(3) NULL,
        PRIMARY KEY (id),
        UNIQUE KEY uq_mail_outbox_key (idempotency_key),
        UNIQUE KEY uq_mail_outbox_mailing_subscriber (mailing_id, subscriber_id),
        KEY ix_mail_outbox_due (state, next_attempt_at),
        KEY ix_mail_outbox_lease (state, lease_until),
        KEY ix_mail_outbox_subscriber (subscriber_id),
        CONSTRAINT fk_mail_outbox_mailing FOREIGN KEY (mailing_id) REFERENCES mailings (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
    await queryRunner.query(`
      CREATE TABLE mail_opt_outs (
        user_id INT UNSIGNED NOT NULL,
        kind VARCHAR(32) CHARACTER SET ascii COLLATE ascii_bin NOT NULL,
        PRIMARY KEY (user_id, kind),
        CONSTRAINT fk_mail_opt_outs_user FOREIGN KEY (user_id) REFERENCES users (id) ON DELETE CASCADE
      ) ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of [
      'mail_opt_outs',
      'mail_outbox',
      'mailings',
      'mail_suppressions',
      'subscriber_categories',
      'subscribers',
      'mail_categories',
      'app_secrets',
    ]) {
      await queryRunner.query(`DROP TABLE ${table}`);
    }
  }
}
