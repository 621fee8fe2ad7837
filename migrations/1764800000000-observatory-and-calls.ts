import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The array (observatory, configurations, receiver bands), calls for proposals with the hours on
 * offer per configuration, and per-call roles with their pending invitations. Units are in the
 * column names; CHECKs repeat the API's rules so no other writer can store nonsense.
 */
export class ObservatoryAndCalls1764800000000 implements MigrationInterface {
  name = 'ObservatoryAndCalls1764800000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE observatories (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL UNIQUE,
        site_latitude_deg double precision NOT NULL CHECK (site_latitude_deg BETWEEN -90 AND 90),
        site_longitude_deg double precision NOT NULL CHECK (site_longitude_deg BETWEEN -180 AND 180),
        site_elevation_m double precision NOT NULL,
        elevation_limit_deg double precision NOT NULL CHECK (elevation_limit_deg >= 0 AND elevation_limit_deg < 90),
        antenna_count int NOT NULL CHECK (antenna_count >= 2),
        dish_diameter_m double precision NOT NULL CHECK (dish_diameter_m > 0),
        correlator_efficiency double precision NOT NULL CHECK (correlator_efficiency > 0 AND correlator_efficiency <= 1),
        calibration_overhead_fraction double precision NOT NULL CHECK (calibration_overhead_fraction >= 0),
        beam_factor double precision NOT NULL DEFAULT 1.13 CHECK (beam_factor > 0),
        time_zone text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE configurations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        observatory_id uuid NOT NULL REFERENCES observatories(id) ON DELETE CASCADE,
        name text NOT NULL,
        shortest_baseline_m double precision NOT NULL CHECK (shortest_baseline_m > 0),
        longest_baseline_m double precision NOT NULL,
        in_use_from date NOT NULL,
        in_use_to date,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (observatory_id, name),
        CHECK (longest_baseline_m >= shortest_baseline_m),
        CHECK (in_use_to IS NULL OR in_use_to >= in_use_from)
      )`);
    await q.query(`
      CREATE TABLE receiver_bands (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        observatory_id uuid NOT NULL REFERENCES observatories(id) ON DELETE CASCADE,
        name text NOT NULL,
        ieee_letter text CHECK (ieee_letter IN ('HF','VHF','UHF','L','S','C','X','Ku','K','Ka','V','W','mm')),
        min_ghz double precision NOT NULL CHECK (min_ghz > 0),
        max_ghz double precision NOT NULL,
        tsys_k double precision NOT NULL CHECK (tsys_k > 0),
        aperture_efficiency double precision NOT NULL CHECK (aperture_efficiency > 0 AND aperture_efficiency <= 1),
        max_bandwidth_mhz double precision NOT NULL CHECK (max_bandwidth_mhz > 0),
        polarizations smallint[] NOT NULL CHECK (cardinality(polarizations) > 0 AND polarizations <@ ARRAY[1,2]::smallint[]),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (observatory_id, name),
        CHECK (max_ghz > min_ghz)
      )`);
    await q.query(`
      CREATE TABLE calls (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        code text NOT NULL UNIQUE CHECK (code ~ '^[A-Z][A-Z0-9-]{1,15}$'),
        observatory_id uuid NOT NULL REFERENCES observatories(id) ON DELETE RESTRICT,
        title text NOT NULL,
        description text NOT NULL DEFAULT '',
        time_zone text NOT NULL,
        opens_at timestamptz NOT NULL,
        deadline_at timestamptz NOT NULL,
        review_due_at timestamptz NOT NULL,
        science_case_page_limit int NOT NULL CHECK (science_case_page_limit > 0),
        science_case_max_mb double precision NOT NULL CHECK (science_case_max_mb > 0),
        proposal_kinds text[] NOT NULL CHECK (
          cardinality(proposal_kinds) > 0
          AND proposal_kinds <@ ARRAY['standard','large','target_of_opportunity','discretionary']
        ),
        max_hours_per_proposal double precision NOT NULL CHECK (max_hours_per_proposal > 0),
        score_min int NOT NULL,
        score_max int NOT NULL,
        score_higher_is_better boolean NOT NULL DEFAULT true,
        referees_per_proposal int NOT NULL CHECK (referees_per_proposal > 0),
        anonymous_review boolean NOT NULL DEFAULT false,
        status text NOT NULL DEFAULT 'planned' CHECK (
          status IN ('planned','open','closed','in_review','deliberation','published','archived')
        ),
        status_changed_at timestamptz NOT NULL DEFAULT now(),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK (deadline_at > opens_at),
        CHECK (review_due_at > deadline_at),
        CHECK (score_max > score_min)
      )`);
    // The deadline job looks for open calls whose deadline has passed.
    await q.query(`CREATE INDEX calls_open_deadline ON calls (deadline_at) WHERE status = 'open'`);
    await q.query(`
      CREATE TABLE call_capacities (
        call_id uuid NOT NULL REFERENCES calls(id) ON DELETE CASCADE,
        configuration_id uuid NOT NULL REFERENCES configurations(id) ON DELETE RESTRICT,
        hours_offered double precision NOT NULL CHECK (hours_offered > 0),
        PRIMARY KEY (call_id, configuration_id)
      )`);
    await q.query(`
      CREATE TABLE call_roles (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        call_id uuid NOT NULL REFERENCES calls(id) ON DELETE CASCADE,
        role text NOT NULL CHECK (role IN ('chair','referee')),
        granted_by uuid REFERENCES users(id) ON DELETE SET NULL,
        granted_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (user_id, call_id, role)
      )`);
    await q.query(`CREATE INDEX call_roles_call ON call_roles (call_id)`);
    await q.query(`
      CREATE TABLE call_role_invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL CHECK (email = lower(email)),
        call_id uuid NOT NULL REFERENCES calls(id) ON DELETE CASCADE,
        role text NOT NULL CHECK (role IN ('chair','referee')),
        invited_by uuid REFERENCES users(id) ON DELETE SET NULL,
        invited_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (email, call_id, role)
      )`);
    await q.query(`CREATE INDEX call_role_invitations_email ON call_role_invitations (email)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE call_role_invitations`);
    await q.query(`DROP TABLE call_roles`);
    await q.query(`DROP TABLE call_capacities`);
    await q.query(`DROP TABLE calls`);
    await q.query(`DROP TABLE receiver_bands`);
    await q.query(`DROP TABLE configurations`);
    await q.query(`DROP TABLE observatories`);
  }
}
