import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Staff invitations: an account created by invitation has no password until its owner sets one through the link
 * in the invitation mail. Only the SHA-256 of the link's token is kept; sending again replaces it, deactivating
 * the account clears it, and accepting marks it used (kept, so a second visit can say the link was already used).
 */
export class AddStaffInvitations1765900001000 implements MigrationInterface {
  name = 'AddStaffInvitations1765900001000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      ALTER TABLE users
        MODIFY password_hash VARCHAR(255) NULL,
        ADD COLUMN invite_token_hash CHAR(64) CHARACTER SET ascii COLLATE ascii_bin NULL,
        ADD COLUMN invite_expires_at DATETIME(3) NULL,
        ADD COLUMN invite_sent_at DATETIME(3) NULL,
        ADD COLUMN invite_accepted_at DATETIME(3) NULL,
        ADD UNIQUE KEY uq_users_invite_token_hash (invite_token_hash)`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    // Accounts that never set a password cannot survive the NOT NULL column: they are removed with their sessions.
    await queryRunner.query('DELETE FROM users WHERE password_hash IS NULL');
    await queryRunner.query(`
      ALTER TABLE users
        DROP KEY uq_users_invite_token_hash,
        DROP COLUMN invite_accepted_at,
        DROP COLUMN invite_sent_at,
        DROP COLUMN invite_expires_at,
        DROP COLUMN invite_token_hash,
        MODIFY password_hash VARCHAR(255) NOT NULL`);
  }
}
