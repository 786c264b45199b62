import type { MigrationInterface, QueryRunner } from "typeorm";

/**
 * The notebook: sources → lab sessions → runs (raw counts in immutable revisions) →
 * reconstructions, uploaded files, and an audit entry per write.
 *
 * Deletion: everything goes with its lab (CASCADE). Inside a lab, a source with sessions and a
 * session with runs cannot be deleted (NO ACTION), so raw data never disappears as a side
 * effect. Revisions, reconstructions and attachments go with their run. People leaving keep
 * their work: created_by becomes NULL.
 * Child rows repeat lab_id with a composite foreign key, so a row can never point into another
 * lab and every list query filters on one indexed column.
 * Timestamps default to clock_timestamp(), not now(): rows written in one transaction (a run
 * with its reconstructions, the seed) still get their true order.
 */
export class Notebook1764720000000 implements MigrationInterface {
  name = "Notebook1764720000000";

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE FUNCTION rhomb_forbid_update() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        RAISE EXCEPTION 'rows of % are immutable (raw data): add a new revision instead', TG_TABLE_NAME
          USING ERRCODE = 'P0001';
      END $$`);

    await q.query(`
      CREATE TABLE sources (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 120),
        crystal text NOT NULL DEFAULT '' CHECK (length(crystal) <= 500),
        pump_laser text NOT NULL DEFAULT '' CHECK (length(pump_laser) <= 500),
        wavelength_nm double precision CHECK (wavelength_nm > 0),
        target_state text NOT NULL DEFAULT 'psi-' CHECK (target_state IN ('phi+', 'phi-', 'psi+', 'psi-')),
        notes text NOT NULL DEFAULT '' CHECK (length(notes) <= 20000),
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        updated_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        UNIQUE (lab_id, id)
      )`);
    await q.query(`CREATE UNIQUE INDEX sources_lab_name_key ON sources (lab_id, lower(name))`);

    await q.query(`
      CREATE TABLE lab_sessions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        source_id uuid NOT NULL,
        title text NOT NULL CHECK (length(btrim(title)) BETWEEN 1 AND 120),
        session_date date NOT NULL,
        people jsonb NOT NULL DEFAULT '[]' CHECK (jsonb_typeof(people) = 'array'),
        pump_wavelength_nm double precision CHECK (pump_wavelength_nm > 0),
        pump_power_mw double precision CHECK (pump_power_mw >= 0),
        crystal_temperature_c double precision CHECK (crystal_temperature_c >= -273.15),
        coincidence_window_ns double precision CHECK (coincidence_window_ns > 0),
        detectors text NOT NULL DEFAULT '' CHECK (length(detectors) <= 500),
        analyser jsonb NOT NULL CHECK (jsonb_typeof(analyser) = 'object'),
        calibration jsonb NOT NULL CHECK (jsonb_typeof(calibration) = 'array'),
        handedness text NOT NULL DEFAULT 'R=H+iV' CHECK (handedness IN ('R=H+iV', 'R=H-iV')),
        notes text NOT NULL DEFAULT '' CHECK (length(notes) <= 20000),
        notes_private boolean NOT NULL DEFAULT false,
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        updated_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        UNIQUE (lab_id, id),
        FOREIGN KEY (lab_id, source_id) REFERENCES sources (lab_id, id)
      )`);
    await q.query(`CREATE INDEX lab_sessions_lab_date_idx ON lab_sessions (lab_id, session_date DESC, created_at DESC)`);
    await q.query(`CREATE INDEX lab_sessions_source_idx ON lab_sessions (source_id, session_date DESC)`);

    await q.query(`
      CREATE TABLE runs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        session_id uuid NOT NULL,
        kind text NOT NULL CHECK (kind IN ('tomography', 'bell', 'fringe')),
        setting_set_id text NOT NULL CHECK (setting_set_id ~ '^[a-z0-9]{1,32}$'),
        name text NOT NULL CHECK (length(btrim(name)) BETWEEN 1 AND 120),
        notes text NOT NULL DEFAULT '' CHECK (length(notes) <= 20000),
        conditions jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(conditions) = 'object'),
        current_revision integer NOT NULL DEFAULT 1 CHECK (current_revision >= 1),
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        updated_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        UNIQUE (lab_id, id),
        FOREIGN KEY (lab_id, session_id) REFERENCES lab_sessions (lab_id, id)
      )`);
    await q.query(`CREATE INDEX runs_lab_created_idx ON runs (lab_id, created_at DESC)`);
    await q.query(`CREATE INDEX runs_session_idx ON runs (session_id, created_at)`);

    await q.query(`
      CREATE TABLE run_revisions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL,
        run_id uuid NOT NULL,
        number integer NOT NULL CHECK (number >= 1),
        rows jsonb NOT NULL CHECK (jsonb_typeof(rows) = 'array' AND jsonb_array_length(rows) BETWEEN 1 AND 1296),
        row_count integer NOT NULL CHECK (row_count = jsonb_array_length(rows)),
        total_counts double precision NOT NULL CHECK (total_counts >= 0),
        reason text NOT NULL DEFAULT '' CHECK (length(reason) <= 500),
        changes jsonb NOT NULL DEFAULT '[]' CHECK (jsonb_typeof(changes) = 'array'),
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        UNIQUE (run_id, number),
        UNIQUE (run_id, id),
        FOREIGN KEY (lab_id, run_id) REFERENCES runs (lab_id, id) ON DELETE CASCADE
      )`);
    // Only the recorded data is frozen; created_by_id may still become NULL when a user is deleted.
    await q.query(`
      CREATE TRIGGER run_revisions_immutable BEFORE UPDATE OF lab_id, run_id, number, rows, row_count, total_counts, reason, changes, created_at
      ON run_revisions FOR EACH ROW EXECUTE FUNCTION rhomb_forbid_update()`);

    await q.query(`
      CREATE TABLE reconstructions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL,
        run_id uuid NOT NULL,
        revision_id uuid NOT NULL,
        method text NOT NULL CHECK (method IN ('linear', 'mle', 'projected')),
        corrections jsonb NOT NULL CHECK (jsonb_typeof(corrections) = 'object'),
        conventions jsonb NOT NULL CHECK (jsonb_typeof(conventions) = 'object'),
        rho jsonb NOT NULL CHECK (jsonb_typeof(rho) = 'object'),
        eigenvalues jsonb NOT NULL CHECK (jsonb_typeof(eigenvalues) = 'array'),
        physical boolean NOT NULL,
        metrics jsonb NOT NULL CHECK (jsonb_typeof(metrics) = 'object'),
        uncertainties jsonb CHECK (uncertainties IS NULL OR jsonb_typeof(uncertainties) = 'object'),
        monte_carlo_samples integer NOT NULL DEFAULT 0 CHECK (monte_carlo_samples BETWEEN 0 AND 10000),
        monte_carlo_seed integer CHECK (monte_carlo_seed >= 0),
        log_likelihood double precision,
        iterations integer CHECK (iterations >= 0),
        converged boolean,
        tolerance double precision CHECK (tolerance > 0),
        total_counts double precision NOT NULL CHECK (total_counts >= 0),
        clipped_rows jsonb NOT NULL DEFAULT '[]' CHECK (jsonb_typeof(clipped_rows) = 'array'),
        warnings jsonb NOT NULL DEFAULT '[]' CHECK (jsonb_typeof(warnings) = 'array'),
        engine_version text NOT NULL CHECK (length(engine_version) BETWEEN 1 AND 40),
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        CHECK ((monte_carlo_samples = 0) = (uncertainties IS NULL)),
        FOREIGN KEY (lab_id, run_id) REFERENCES runs (lab_id, id) ON DELETE CASCADE,
        FOREIGN KEY (run_id, revision_id) REFERENCES run_revisions (run_id, id) ON DELETE CASCADE
      )`);
    await q.query(`
      CREATE TRIGGER reconstructions_immutable BEFORE UPDATE OF lab_id, run_id, revision_id, method, corrections, conventions, rho, eigenvalues, metrics, uncertainties, monte_carlo_seed
      ON reconstructions FOR EACH ROW EXECUTE FUNCTION rhomb_forbid_update()`);
    await q.query(`CREATE INDEX reconstructions_run_idx ON reconstructions (run_id, created_at DESC)`);
    await q.query(`CREATE INDEX reconstructions_revision_method_idx ON reconstructions (revision_id, method, created_at DESC)`);
    await q.query(`CREATE INDEX reconstructions_lab_method_idx ON reconstructions (lab_id, method)`);

    await q.query(`
      CREATE TABLE attachments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL,
        run_id uuid NOT NULL,
        file_name text NOT NULL CHECK (length(file_name) BETWEEN 1 AND 255),
        content_type text NOT NULL CHECK (length(content_type) BETWEEN 1 AND 255),
        size_bytes integer NOT NULL CHECK (size_bytes = octet_length(content)),
        sha256 text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
        content bytea NOT NULL,
        created_by_id uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT clock_timestamp(),
        FOREIGN KEY (lab_id, run_id) REFERENCES runs (lab_id, id) ON DELETE CASCADE
      )`);
    await q.query(`CREATE INDEX attachments_run_idx ON attachments (run_id)`);
    await q.query(`
      CREATE TRIGGER attachments_immutable BEFORE UPDATE OF lab_id, run_id, file_name, content_type, size_bytes, sha256, content, created_at
      ON attachments FOR EACH ROW EXECUTE FUNCTION rhomb_forbid_update()`);

    await q.query(`
      CREATE TABLE audit_entries (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        lab_id uuid NOT NULL REFERENCES labs(id) ON DELETE CASCADE,
        actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
        action text NOT NULL CHECK (action ~ '^[a-z][a-zA-Z]*(\\.[a-z][a-zA-Z]*)+$'),
        entity_type text NOT NULL CHECK (length(entity_type) BETWEEN 1 AND 40),
        entity_id uuid NOT NULL,
        changes jsonb NOT NULL DEFAULT '{}' CHECK (jsonb_typeof(changes) = 'object'),
        created_at timestamptz NOT NULL DEFAULT clock_timestamp()
      )`);
    await q.query(`CREATE INDEX audit_entries_lab_idx ON audit_entries (lab_id, created_at DESC)`);
    await q.query(`CREATE INDEX audit_entries_entity_idx ON audit_entries (entity_type, entity_id, created_at DESC)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE audit_entries`);
    await q.query(`DROP TABLE attachments`);
    await q.query(`DROP TABLE reconstructions`);
    await q.query(`DROP TABLE run_revisions`);
    await q.query(`DROP TABLE runs`);
    await q.query(`DROP TABLE lab_sessions`);
    await q.query(`DROP TABLE sources`);
    await q.query(`DROP FUNCTION rhomb_forbid_update()`);
  }
}
