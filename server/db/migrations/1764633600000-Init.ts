import type { MigrationInterface, QueryRunner } from "typeorm";

/** Users, labs and roles, and the table connect-pg-simple keeps sign-in sessions in. */
export class Init1764633600000 implements MigrationInterface {
  name = "Init1764633600000";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`CREATE EXTENSION IF NOT EXISTS pgcrypto`);
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL UNIQUE CHECK (email = lower(email)),
        display_name text NOT NULL,
        password_hash text NOT NULL,
        email_verified_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE labs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL,
        institution text NOT NULL DEFAULT '',
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE lab_memberships (
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        role text NOT NULL CHECK (role IN ('owner', 'member', 'viewer')),
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (lab_id, user_id)
      )`);
    await q.query(`CREATE INDEX lab_memberships_user_idx ON lab_memberships (user_id)`);
    await q.query(`
      CREATE TABLE http_sessions (
        sid varchar PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX http_sessions_expire_idx ON http_sessions (expire)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE http_sessions`);
    await q.query(`DROP TABLE lab_memberships`);
    await q.query(`DROP TABLE labs`);
    await q.query(`DROP TABLE users`);
  }
}
