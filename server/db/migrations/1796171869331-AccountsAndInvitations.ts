import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * One-time e-mail links (address verification, password reset) and lab invitations. Only the
 * SHA-256 of each link's secret is stored, so a copy of the database opens no account.
 */
export class AccountsAndInvitations1796171869331 implements MigrationInterface {
  name = "AccountsAndInvitations1796171869331";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE email_tokens (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        purpose text NOT NULL CHECK (purpose IN ('verify-email', 'reset-password')),
        token_sha256 text NOT NULL UNIQUE CHECK (token_sha256 ~ '^[0-9a-f]{64}$'),
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        used_at timestamptz
      )`);
    await q.query(`CREATE INDEX email_tokens_user_idx ON email_tokens (user_id, purpose)`);
    await q.query(`
      CREATE TABLE invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        email text NOT NULL CHECK (email = lower(email)),
        role text NOT NULL CHECK (role IN ('owner', 'member', 'viewer')),
        token_sha256 text NOT NULL UNIQUE CHECK (token_sha256 ~ '^[0-9a-f]{64}$'),
        invited_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        accepted_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        revoked_at timestamptz
      )`);
    // At most one open invitation per address and lab: inviting again replaces the old one.
    await q.query(`CREATE UNIQUE INDEX invitations_open_idx ON invitations (lab_id, email) WHERE accepted_at IS NULL AND revoked_at IS NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE invitations`);
    await q.query(`DROP TABLE email_tokens`);
  }
}
