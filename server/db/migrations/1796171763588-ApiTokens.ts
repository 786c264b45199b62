import type { MigrationInterface, QueryRunner } from "typeorm";

/** Personal API tokens (secret kept as its SHA-256 only). */
export class ApiTokens1796171763588 implements MigrationInterface {
  name = "ApiTokens1796171763588";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE api_tokens (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        name text NOT NULL,
        secret_sha256 text NOT NULL UNIQUE CHECK (secret_sha256 ~ '^[0-9a-f]{64}$'),
        hint text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        last_used_at timestamptz,
        expires_at timestamptz,
        revoked_at timestamptz
      )`);
    await q.query(`CREATE INDEX api_tokens_user_idx ON api_tokens (user_id, created_at)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE api_tokens`);
  }
}
