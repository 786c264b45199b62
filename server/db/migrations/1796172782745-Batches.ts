import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * Batch uploads: a batch per upload, a batch_files row per run file with its status, bytes and
 * SHA-256. The queue itself (pg-boss) keeps its own tables in the "pgboss" schema, which
 * pg-boss creates and migrates on start.
 */
export class Batches1796172782745 implements MigrationInterface {
  name = "Batches1796172782745";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE batches (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        session_id uuid NOT NULL,
        origin text NOT NULL CHECK (origin IN ('browser', 'token')),
        token_id uuid REFERENCES api_tokens(id) ON DELETE SET NULL,
        file_count integer NOT NULL CHECK (file_count >= 1),
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (lab_id, id),
        FOREIGN KEY (lab_id, session_id) REFERENCES lab_sessions (lab_id, id) ON DELETE CASCADE
      )`);
    await q.query(`CREATE INDEX batches_lab_created_idx ON batches (lab_id, created_at DESC)`);
    await q.query(`CREATE INDEX batches_session_idx ON batches (session_id, created_at DESC)`);

    await q.query(`
      CREATE TABLE batch_files (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL,
        batch_id uuid NOT NULL,
        position integer NOT NULL CHECK (position >= 0),
        file_name text NOT NULL CHECK (length(file_name) BETWEEN 1 AND 600),
        format text CHECK (format IN ('run-csv', 'run-json', 'sweep-line')),
        source_line integer CHECK (source_line >= 1),
        size_bytes integer NOT NULL CHECK (size_bytes >= 0),
        sha256 text CHECK (sha256 ~ '^[0-9a-f]{64}$'),
        content bytea,
        status text NOT NULL CHECK (status IN ('queued', 'processing', 'stored', 'failed', 'duplicate')),
        message text,
        issues jsonb NOT NULL DEFAULT '[]' CHECK (jsonb_typeof(issues) = 'array'),
        run_id uuid,
        duplicate_of_run_id uuid,
        attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
        started_at timestamptz,
        finished_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (batch_id, position),
        CHECK (format IS NULL OR (content IS NOT NULL AND sha256 IS NOT NULL)),
        CHECK (status IN ('stored', 'failed', 'duplicate') = (finished_at IS NOT NULL)),
        FOREIGN KEY (lab_id, batch_id) REFERENCES batches (lab_id, id) ON DELETE CASCADE,
        FOREIGN KEY (lab_id, run_id) REFERENCES runs (lab_id, id) ON DELETE SET NULL (run_id),
        FOREIGN KEY (lab_id, duplicate_of_run_id) REFERENCES runs (lab_id, id) ON DELETE SET NULL (duplicate_of_run_id)
      )`);
    await q.query(`CREATE INDEX batch_files_lab_sha_idx ON batch_files (lab_id, sha256)`);
    await q.query(`CREATE INDEX batch_files_run_idx ON batch_files (run_id) WHERE run_id IS NOT NULL`);
    // Duplicate detection looks stored content up by (lab, SHA-256) for every file of a batch.
    await q.query(`CREATE INDEX attachments_lab_sha_idx ON attachments (lab_id, sha256)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX attachments_lab_sha_idx`);
    await q.query(`DROP TABLE batch_files`);
    await q.query(`DROP TABLE batches`);
  }
}
