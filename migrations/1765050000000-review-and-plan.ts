import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * After the deadline: staff's technical assessments, referees' declared conflicts and their
 * assignments (the review lives on the assignment row), reminders sent, the chair's grants per
 * observation and decision (tier) per proposal, the call's publication; then operations: the plan
 * settings per call, the runs, the completion e-mail and private calendar links.
 */
export class ReviewAndPlan1765050000000 implements MigrationInterface {
  name = 'ReviewAndPlan1765050000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE calls ADD COLUMN published_at timestamptz`);
    await q.query(`ALTER TABLE proposals ADD COLUMN completed_at timestamptz`);

    await q.query(`
      CREATE TABLE technical_assessments (
        proposal_id uuid PRIMARY KEY REFERENCES proposals(id) ON DELETE CASCADE,
        verdict text NOT NULL CHECK (verdict IN ('feasible','feasible_with_changes','not_feasible')),
        note text NOT NULL DEFAULT '' CHECK (length(note) <= 10000),
        assessed_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);

    // Conflicts a referee declared themselves; the automatic ones (team member, shared
    // affiliation) are computed from the team and never stored, so they follow team changes.
    await q.query(`
      CREATE TABLE referee_conflicts (
        referee_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        reason text NOT NULL CHECK (length(reason) BETWEEN 1 AND 2000),
        declared_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (referee_id, proposal_id)
      )`);

    await q.query(`
      CREATE TABLE review_assignments (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        proposal_id uuid NOT NULL REFERENCES proposals(id) ON DELETE CASCADE,
        referee_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        status text NOT NULL DEFAULT 'invited' CHECK (
          status IN ('invited','accepted','declined','conflicted','submitted')),
        assigned_by uuid REFERENCES users(id) ON DELETE SET NULL,
        assigned_at timestamptz NOT NULL DEFAULT now(),
        notified_at timestamptz,
        decline_reason text CHECK (length(decline_reason) <= 2000),
        score double precision,
        comment_to_pi text NOT NULL DEFAULT '' CHECK (length(comment_to_pi) <= 20000),
        comment_to_committee text NOT NULL DEFAULT '' CHECK (length(comment_to_committee) <= 20000),
        expertise smallint CHECK (expertise BETWEEN 1 AND 3),
        submitted_at timestamptz,
        version int NOT NULL DEFAULT 1 CHECK (version >= 1),
        updated_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (proposal_id, referee_id),
        CHECK (status <> 'submitted' OR (score IS NOT NULL AND expertise IS NOT NULL AND submitted_at IS NOT NULL))
      )`);
    await q.query(`CREATE INDEX review_assignments_referee ON review_assignments (referee_id)`);

    await q.query(`
      CREATE TABLE review_reminders (
        assignment_id uuid NOT NULL REFERENCES review_assignments(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('3d','1d')),
        due_at timestamptz NOT NULL,
        sent_at timestamptz NOT NULL,
        PRIMARY KEY (assignment_id, kind, due_at)
      )`);

    // The chair's decision on a proposal; hours per observation below. No row: undecided.
    await q.query(`
      CREATE TABLE proposal_grants (
        proposal_id uuid PRIMARY KEY REFERENCES proposals(id) ON DELETE CASCADE,
        tier text NOT NULL CHECK (tier IN ('tier1','tier2','tier3','not_allocated')),
        note text NOT NULL DEFAULT '' CHECK (length(note) <= 5000),
        decided_by uuid REFERENCES users(id) ON DELETE SET NULL,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE observation_grants (
        observation_id uuid PRIMARY KEY REFERENCES proposal_observations(id) ON DELETE CASCADE,
        proposal_id uuid NOT NULL REFERENCES proposal_grants(proposal_id) ON DELETE CASCADE,
        hours double precision NOT NULL CHECK (hours >= 0)
      )`);
    await q.query(`CREATE INDEX observation_grants_proposal ON observation_grants (proposal_id)`);

    // Operations. One row of settings per call's plan; `unplaced` is the generator's last list
    // of what did not fit, with reasons.
    await q.query(`
      CREATE TABLE plans (
        call_id uuid PRIMARY KEY REFERENCES calls(id) ON DELETE CASCADE,
        maintenance_start_hour smallint NOT NULL DEFAULT 8 CHECK (maintenance_start_hour BETWEEN 0 AND 23),
        maintenance_hours smallint NOT NULL DEFAULT 0 CHECK (maintenance_hours BETWEEN 0 AND 23),
        weather_reserve double precision NOT NULL DEFAULT 0.1 CHECK (weather_reserve >= 0 AND weather_reserve < 1),
        unplaced jsonb NOT NULL DEFAULT '[]',
        generated_at timestamptz,
        generated_by uuid REFERENCES users(id) ON DELETE SET NULL,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    // The array observes one thing at a time, whichever call the run belongs to: the exclusion
    // constraint refuses overlapping runs from any writer.
    await q.query(`
      CREATE TABLE runs (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        call_id uuid NOT NULL REFERENCES calls(id) ON DELETE CASCADE,
        observation_id uuid NOT NULL REFERENCES proposal_observations(id) ON DELETE CASCADE,
        starts_at timestamptz NOT NULL,
        ends_at timestamptz NOT NULL,
        status text NOT NULL DEFAULT 'planned' CHECK (status IN ('planned','observed','lost')),
        locked boolean NOT NULL DEFAULT false,
        hours_obtained double precision CHECK (hours_obtained >= 0),
        quality_note text NOT NULL DEFAULT '' CHECK (length(quality_note) <= 5000),
        lost_reason text CHECK (lost_reason IN ('weather','fault')),
        recorded_by uuid REFERENCES users(id) ON DELETE SET NULL,
        recorded_at timestamptz,
        version int NOT NULL DEFAULT 1 CHECK (version >= 1),
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK (ends_at > starts_at),
        CHECK (status <> 'observed' OR hours_obtained IS NOT NULL),
        CHECK ((status = 'lost') = (lost_reason IS NOT NULL)),
        EXCLUDE USING gist (tstzrange(starts_at, ends_at) WITH &&)
      )`);
    await q.query(`CREATE INDEX runs_call ON runs (call_id, starts_at)`);
    await q.query(`CREATE INDEX runs_observation ON runs (observation_id)`);

    // A private link to one person's runs as an iCalendar feed: only the hash is kept.
    await q.query(`
      CREATE TABLE calendar_feeds (
        user_id uuid PRIMARY KEY REFERENCES users(id) ON DELETE CASCADE,
        token_sha256 text NOT NULL UNIQUE CHECK (token_sha256 ~ '^[0-9a-f]{64}$'),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE calendar_feeds`);
    await q.query(`DROP TABLE runs`);
    await q.query(`DROP TABLE plans`);
    await q.query(`DROP TABLE observation_grants`);
    await q.query(`DROP TABLE proposal_grants`);
    await q.query(`DROP TABLE review_reminders`);
    await q.query(`DROP TABLE review_assignments`);
    await q.query(`DROP TABLE referee_conflicts`);
    await q.query(`DROP TABLE technical_assessments`);
    await q.query(`ALTER TABLE proposals DROP COLUMN completed_at`);
    await q.query(`ALTER TABLE calls DROP COLUMN published_at`);
  }
}
