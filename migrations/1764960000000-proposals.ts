import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Proposals: the proposal with its per-call number, its team (with pending invitations by
 * address), targets, observations with the calculator's stored results, the submitted versions
 * (snapshot and compiled PDF) and the reminders already sent. The documents table gets the
 * foreign key it was waiting for. CHECKs repeat the API's rules so no other writer can store
 * nonsense.
 */
export class Proposals1764960000000 implements MigrationInterface {
  name = 'Proposals1764960000000';

  async up(q: QueryRunner): Promise<void> {
    // One row per call with the last number given out: the UPSERT that hands out a number takes
    // the row's lock, so two proposals created at once never share one.
    await q.query(`
      CREATE TABLE proposal_counters (
        call_id uuid PRIMARY KEY REFERENCES calls(id) ON DELETE CASCADE,
        last_number int NOT NULL CHECK (last_number BETWEEN 1 AND 9999)
      )`);
    await q.query(`
      CREATE TABLE proposals (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        call_id uuid NOT NULL REFERENCES calls(id) ON DELETE RESTRICT,
        number int NOT NULL CHECK (number BETWEEN 1 AND 9999),
        reference text NOT NULL UNIQUE CHECK (reference ~ '^[A-Z][A-Z0-9-]{1,15}-[0-9]{4}$'),
        title text NOT NULL CHECK (length(title) <= 300),
        abstract text NOT NULL DEFAULT '' CHECK (length(abstract) <= 20000),
        science_category text,
        kind text NOT NULL CHECK (kind IN ('standard','large','target_of_opportunity','discretionary')),
        continues_id uuid REFERENCES proposals(id) ON DELETE SET NULL,
        status text NOT NULL DEFAULT 'draft' CHECK (status IN (
          'draft','submitted','withdrawn','under_review','allocated','not_allocated','in_progress','completed')),
        version int NOT NULL DEFAULT 1 CHECK (version >= 1),
        submitted_version int CHECK (submitted_version >= 1),
        submitted_at timestamptz,
        withdrawn_at timestamptz,
        science_case_findings jsonb NOT NULL DEFAULT '[]',
        science_case_names_checked text[] NOT NULL DEFAULT '{}',
        created_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (call_id, number),
        CHECK (continues_id IS NULL OR continues_id <> id),
        CHECK ((submitted_version IS NULL) = (submitted_at IS NULL))
      )`);
    await q.query(`CREATE INDEX proposals_call_status ON proposals (call_id, status)`);

    // A member is either a user (joined_at set) or a pending invitation by address.
    await q.query(`
      CREATE TABLE proposal_members (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        user_id uuid REFERENCES users(id) ON DELETE CASCADE,
        email text NOT NULL CHECK (email = lower(email) AND length(email) <= 320),
        role text NOT NULL CHECK (role IN ('pi','coi')),
        can_edit boolean NOT NULL,
        invited_by uuid REFERENCES users(id) ON DELETE SET NULL,
        invited_at timestamptz NOT NULL,
        joined_at timestamptz,
        UNIQUE (proposal_id, email),
        UNIQUE (proposal_id, user_id),
        CHECK ((user_id IS NULL) = (joined_at IS NULL)),
        CHECK (role = 'coi' OR (user_id IS NOT NULL AND can_edit))
      )`);
    await q.query(
      `CREATE UNIQUE INDEX proposal_members_one_pi ON proposal_members (proposal_id) WHERE role = 'pi'`,
    );
    await q.query(`CREATE INDEX proposal_members_user ON proposal_members (user_id)`);
    await q.query(
      `CREATE INDEX proposal_members_pending ON proposal_members (email) WHERE user_id IS NULL`,
    );

    await q.query(`
      CREATE TABLE proposal_targets (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        position int NOT NULL,
        name text NOT NULL CHECK (length(name) BETWEEN 1 AND 100),
        ra_deg double precision NOT NULL CHECK (ra_deg >= 0 AND ra_deg < 360),
        dec_deg double precision NOT NULL CHECK (dec_deg BETWEEN -90 AND 90),
        extent_arcsec double precision NOT NULL DEFAULT 0 CHECK (extent_arcsec BETWEEN 0 AND 648000),
        flux_density_mjy double precision CHECK (flux_density_mjy >= 0),
        line_rest_ghz double precision CHECK (line_rest_ghz > 0),
        line_velocity_km_s double precision CHECK (abs(line_velocity_km_s) < 299792.458),
        line_convention text CHECK (line_convention IN ('radio','optical','relativistic')),
        line_redshift double precision CHECK (line_redshift > -1),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK (
          (line_rest_ghz IS NULL AND line_velocity_km_s IS NULL AND line_convention IS NULL AND line_redshift IS NULL)
          OR (line_rest_ghz IS NOT NULL AND line_velocity_km_s IS NOT NULL AND line_convention IS NOT NULL AND line_redshift IS NULL)
          OR (line_rest_ghz IS NOT NULL AND line_redshift IS NOT NULL AND line_velocity_km_s IS NULL AND line_convention IS NULL)
        )
      )`);
    await q.query(
      `CREATE UNIQUE INDEX proposal_targets_name ON proposal_targets (proposal_id, lower(name))`,
    );

    // Band and configuration keep the default NO ACTION: staff cannot remove a band or a
    // configuration that an observation uses (the observatory service answers 409 IN_USE).
    await q.query(`
      CREATE TABLE proposal_observations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        position int NOT NULL,
        target_id uuid NOT NULL REFERENCES proposal_targets(id),
        band_id uuid NOT NULL REFERENCES receiver_bands(id),
        configuration_id uuid NOT NULL REFERENCES configurations(id),
        frequency_ghz double precision CHECK (frequency_ghz > 0),
        bandwidth_mhz double precision NOT NULL CHECK (bandwidth_mhz > 0),
        spectral_resolution_khz double precision CHECK (spectral_resolution_khz > 0),
        polarizations smallint NOT NULL CHECK (polarizations IN (1, 2)),
        rms_goal_micro_jy double precision CHECK (rms_goal_micro_jy > 0),
        resolution_goal_arcsec double precision CHECK (resolution_goal_arcsec > 0),
        hours_asked double precision NOT NULL CHECK (hours_asked > 0),
        result jsonb NOT NULL,
        checks jsonb NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(
      `CREATE INDEX proposal_observations_proposal ON proposal_observations (proposal_id, position)`,
    );
    await q.query(`CREATE INDEX proposal_observations_target ON proposal_observations (target_id)`);

    await q.query(`
      CREATE TABLE proposal_versions (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        number int NOT NULL CHECK (number >= 1),
        submitted_at timestamptz NOT NULL,
        submitted_by uuid REFERENCES users(id) ON DELETE SET NULL,
        total_hours double precision NOT NULL CHECK (total_hours >= 0),
        snapshot jsonb NOT NULL,
        science_case_id uuid REFERENCES documents(id),
        compiled_pdf bytea NOT NULL,
        compiled_pdf_sha256 text NOT NULL CHECK (compiled_pdf_sha256 ~ '^[0-9a-f]{64}$'),
        UNIQUE (proposal_id, number)
      )`);
    // PDFs are compressed already.
    await q.query(`ALTER TABLE proposal_versions ALTER COLUMN compiled_pdf SET STORAGE EXTERNAL`);

    // One row per reminder sent; the primary key makes each go once, whichever process sends it.
    // The deadline is part of the key, so a moved deadline earns fresh reminders.
    await q.query(`
      CREATE TABLE proposal_reminders (
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('7d','1d')),
        deadline_at timestamptz NOT NULL,
        sent_at timestamptz NOT NULL,
        PRIMARY KEY (proposal_id, kind, deadline_at)
      )`);

    // Rows written before proposals existed (the document services' own tests) belong to no
    // proposal and cannot be kept under the new key.
    await q.query(`DELETE FROM documents WHERE proposal_id NOT IN (SELECT id FROM proposals)`);
    await q.query(`
      ALTER TABLE documents ADD CONSTRAINT documents_proposal_fk
        FOREIGN KEY (proposal_id) REFERENCES proposals(id) ON DELETE CASCADE`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE documents DROP CONSTRAINT documents_proposal_fk`);
    await q.query(`DROP TABLE proposal_reminders`);
    await q.query(`DROP TABLE proposal_versions`);
    await q.query(`DROP TABLE proposal_observations`);
    await q.query(`DROP TABLE proposal_targets`);
    await q.query(`DROP TABLE proposal_members`);
    await q.query(`DROP TABLE proposals`);
    await q.query(`DROP TABLE proposal_counters`);
  }
}
