import { sql, type Kysely } from "kysely";

// The foundation: people and roles, the consortium's sites, telescopes and programs,
// and the schedule of blocks. Two blocks on one telescope can never overlap: that is a
// btree_gist exclusion constraint, so it holds however many app instances write at once.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`CREATE EXTENSION IF NOT EXISTS btree_gist`.execute(db);
  await sql`CREATE EXTENSION IF NOT EXISTS pgcrypto`.execute(db);

  await sql`
    CREATE TABLE users (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      email text NOT NULL,
      name text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
      password_hash text NOT NULL,
      disabled_at timestamptz,
      created_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT users_email_lower CHECK (email = lower(email))
    );
    CREATE UNIQUE INDEX users_email_key ON users (email);

    CREATE TABLE user_roles (
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      role text NOT NULL CHECK (role IN ('pi', 'director', 'observer', 'night_assistant', 'admin')),
      PRIMARY KEY (user_id, role)
    );

    CREATE TABLE partners (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      code text NOT NULL UNIQUE,
      name text NOT NULL
    );

    CREATE TABLE sites (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      code text NOT NULL UNIQUE,
      name text NOT NULL,
      latitude_deg numeric NOT NULL CHECK (latitude_deg BETWEEN -90 AND 90),
      longitude_deg numeric NOT NULL CHECK (longitude_deg > -180 AND longitude_deg <= 180),
      height_m numeric NOT NULL DEFAULT 0,
      time_zone text NOT NULL
    );

    CREATE TABLE telescopes (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      site_id uuid NOT NULL REFERENCES sites (id),
      code text NOT NULL UNIQUE,
      name text NOT NULL,
      aperture_m numeric NOT NULL CHECK (aperture_m > 0),
      min_altitude_deg numeric NOT NULL DEFAULT 20 CHECK (min_altitude_deg BETWEEN 0 AND 90),
      max_airmass numeric NOT NULL DEFAULT 2.9 CHECK (max_airmass >= 1),
      sun_avoidance_deg numeric NOT NULL DEFAULT 45 CHECK (sun_avoidance_deg BETWEEN 0 AND 180),
      hour_angle_min_h numeric NOT NULL DEFAULT -12 CHECK (hour_angle_min_h BETWEEN -12 AND 0),
      hour_angle_max_h numeric NOT NULL DEFAULT 12 CHECK (hour_angle_max_h BETWEEN 0 AND 12),
      setup_minutes integer NOT NULL DEFAULT 10 CHECK (setup_minutes >= 0)
    );

    CREATE TABLE telescope_assistants (
      telescope_id uuid NOT NULL REFERENCES telescopes (id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      PRIMARY KEY (telescope_id, user_id)
    );

    CREATE TABLE instruments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      telescope_id uuid NOT NULL REFERENCES telescopes (id) ON DELETE CASCADE,
      code text NOT NULL,
      name text NOT NULL,
      limiting_magnitude numeric NOT NULL,
      UNIQUE (telescope_id, code)
    );

    CREATE TABLE semesters (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      code text NOT NULL UNIQUE,
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      CHECK (ends_at > starts_at)
    );

    CREATE TABLE programs (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      code text NOT NULL UNIQUE,
      title text NOT NULL,
      semester_id uuid NOT NULL REFERENCES semesters (id),
      partner_id uuid NOT NULL REFERENCES partners (id),
      pi_user_id uuid NOT NULL REFERENCES users (id),
      rank integer NOT NULL CHECK (rank BETWEEN 1 AND 5),
      allocated_hours numeric NOT NULL DEFAULT 0 CHECK (allocated_hours >= 0),
      category text NOT NULL CHECK (category IN ('science', 'engineering', 'discretionary', 'too', 'payback')),
      too_allowed boolean NOT NULL DEFAULT false
    );

    CREATE TABLE program_observers (
      program_id uuid NOT NULL REFERENCES programs (id) ON DELETE CASCADE,
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      PRIMARY KEY (program_id, user_id)
    );

    CREATE TABLE blocks (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      telescope_id uuid NOT NULL REFERENCES telescopes (id),
      program_id uuid NOT NULL REFERENCES programs (id),
      observer_user_id uuid REFERENCES users (id),
      instrument_id uuid REFERENCES instruments (id),
      kind text NOT NULL CHECK (kind IN ('science', 'engineering', 'discretionary', 'too', 'payback')),
      starts_at timestamptz NOT NULL,
      ends_at timestamptz NOT NULL,
      notes text NOT NULL DEFAULT '',
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      CONSTRAINT blocks_positive_length CHECK (ends_at > starts_at),
      -- Half-open ranges: a block ending at 03:00 and the next starting at 03:00 touch, not overlap.
      CONSTRAINT blocks_no_overlap EXCLUDE USING gist (
        telescope_id WITH =,
        tstzrange(starts_at, ends_at, '[)') WITH &&
      )
    );
    CREATE INDEX blocks_program_idx ON blocks (program_id);
    CREATE INDEX blocks_observer_idx ON blocks (observer_user_id);

    CREATE TABLE audit_log (
      id bigserial PRIMARY KEY,
      at timestamptz NOT NULL DEFAULT now(),
      actor_user_id uuid REFERENCES users (id),
      action text NOT NULL,
      entity text NOT NULL,
      entity_id text,
      details jsonb NOT NULL DEFAULT '{}'
    );
    CREATE INDEX audit_log_entity_idx ON audit_log (entity, entity_id);

    CREATE TABLE api_tokens (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      name text NOT NULL,
      token_prefix text NOT NULL,
      token_hash text NOT NULL UNIQUE,
      created_at timestamptz NOT NULL DEFAULT now(),
      last_used_at timestamptz,
      revoked_at timestamptz
    );

    -- The table layout rate-limiter-flexible's PostgreSQL store expects.
    CREATE TABLE rate_limits (
      key varchar(255) PRIMARY KEY,
      points integer NOT NULL DEFAULT 0,
      expire bigint
    );
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DROP TABLE IF EXISTS rate_limits, api_tokens, audit_log, blocks, program_observers, programs,
      semesters, instruments, telescope_assistants, telescopes, sites, partners, user_roles, users;
  `.execute(db);
}
