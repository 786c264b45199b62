import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Shares: one lab item (a lab session, a run or a reconstruction) opened read-only to people
 * outside the lab, by a secret link (only the SHA-256 of its token is stored) or to a guest's
 * e-mail address. Exactly one item column is set, matching item_type; the item's lab must be
 * the share's lab (composite keys where the item table has them). A share goes with its item.
 * Revoking keeps the row (revoked_at), so the lab's list says who closed it and when.
 */
export class Shares1796172629388 implements MigrationInterface {
  name = "Shares1796172629388";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE shares (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('link', 'guest')),
        item_type text NOT NULL CHECK (item_type IN ('session', 'run', 'reconstruction')),
        session_id uuid,
        run_id uuid,
        reconstruction_id uuid REFERENCES reconstructions(id) ON DELETE CASCADE,
        token_sha256 text UNIQUE CHECK (token_sha256 ~ '^[0-9a-f]{64}$'),
        email text CHECK (email = lower(email) AND length(email) BETWEEN 3 AND 254),
        label text NOT NULL DEFAULT '' CHECK (length(label) <= 500),
        expires_at timestamptz,
        revoked_at timestamptz,
        revoked_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        open_count integer NOT NULL DEFAULT 0 CHECK (open_count >= 0),
        last_opened_at timestamptz,
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        CHECK ((kind = 'link') = (token_sha256 IS NOT NULL)),
        CHECK ((kind = 'guest') = (email IS NOT NULL)),
        CHECK ((item_type = 'session') = (session_id IS NOT NULL)),
        CHECK ((item_type = 'run') = (run_id IS NOT NULL)),
        CHECK ((item_type = 'reconstruction') = (reconstruction_id IS NOT NULL)),
        CHECK (expires_at IS NULL OR expires_at > created_at),
        FOREIGN KEY (lab_id, session_id) REFERENCES lab_sessions (lab_id, id) ON DELETE CASCADE,
        FOREIGN KEY (lab_id, run_id) REFERENCES runs (lab_id, id) ON DELETE CASCADE
      )`);
    await q.query(`CREATE INDEX shares_lab_idx ON shares (lab_id, created_at DESC)`);
    await q.query(`CREATE INDEX shares_session_idx ON shares (session_id) WHERE session_id IS NOT NULL`);
    await q.query(`CREATE INDEX shares_run_idx ON shares (run_id) WHERE run_id IS NOT NULL`);
    await q.query(`CREATE INDEX shares_reconstruction_idx ON shares (reconstruction_id) WHERE reconstruction_id IS NOT NULL`);
    await q.query(`CREATE INDEX shares_guest_email_idx ON shares (email) WHERE kind = 'guest'`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE shares`);
  }
}
