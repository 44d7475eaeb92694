import { sql, type Kysely } from "kysely";

// Target-of-opportunity requests. A draft may be half filled (the form saves as the PI
// types), so most columns are nullable; a CHECK makes them required once the request
// leaves the draft state. Every state change is a row in request_events. Attachments
// point at files kept by the upload service (UploadThing or its local fake): we store the
// service's key and URL, never a path built from the uploader's file name.
// idempotency_keys lets an alert pipeline retry a POST without filing twice.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    CREATE TABLE too_requests (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      pi_user_id uuid NOT NULL REFERENCES users (id),
      program_id uuid REFERENCES programs (id),
      source text NOT NULL DEFAULT 'form' CHECK (source IN ('form', 'api')),
      target_name text NOT NULL DEFAULT '' CHECK (length(target_name) <= 200),
      target_kind text NOT NULL DEFAULT 'fixed' CHECK (target_kind IN ('fixed', 'ephemeris')),
      ra_text text NOT NULL DEFAULT '' CHECK (length(ra_text) <= 100),
      dec_text text NOT NULL DEFAULT '' CHECK (length(dec_text) <= 100),
      ra_deg numeric CHECK (ra_deg >= 0 AND ra_deg < 360),
      dec_deg numeric CHECK (dec_deg BETWEEN -90 AND 90),
      ephemeris jsonb CHECK (ephemeris IS NULL OR jsonb_typeof(ephemeris) = 'array'),
      h_mag numeric CHECK (h_mag BETWEEN -10 AND 40),
      g_slope numeric CHECK (g_slope BETWEEN -0.5 AND 1.5),
      instrument_id uuid REFERENCES instruments (id),
      duration_minutes integer CHECK (duration_minutes BETWEEN 1 AND 1440),
      earliest_start timestamptz,
      latest_end timestamptz,
      deadline timestamptz,
      urgency text CHECK (urgency IN ('now', 'tonight', 'within_days')),
      max_airmass numeric CHECK (max_airmass >= 1),
      darkness text NOT NULL DEFAULT 'nautical' CHECK (darkness IN ('civil', 'nautical', 'astronomical')),
      min_moon_sep_deg numeric CHECK (min_moon_sep_deg BETWEEN 0 AND 180),
      max_moon_illum numeric CHECK (max_moon_illum BETWEEN 0 AND 1),
      justification text NOT NULL DEFAULT '',
      state text NOT NULL DEFAULT 'draft' CHECK (state IN (
        'draft', 'submitted', 'in_review', 'approved', 'declined', 'withdrawn', 'lapsed',
        'executed', 'partially_executed', 'not_executed'
      )),
      feasibility jsonb,
      director_note text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      submitted_at timestamptz,
      CONSTRAINT too_requests_window_order CHECK (earliest_start IS NULL OR latest_end IS NULL OR latest_end > earliest_start),
      CONSTRAINT too_requests_deadline_order CHECK (earliest_start IS NULL OR deadline IS NULL OR deadline > earliest_start),
      -- Once filed, a request is complete: the service checks this with clear messages first.
      CONSTRAINT too_requests_complete_when_filed CHECK (
        state = 'draft' OR (
          program_id IS NOT NULL AND instrument_id IS NOT NULL AND duration_minutes IS NOT NULL
          AND earliest_start IS NOT NULL AND latest_end IS NOT NULL AND deadline IS NOT NULL
          AND urgency IS NOT NULL AND submitted_at IS NOT NULL AND length(target_name) > 0
          AND ((target_kind = 'fixed' AND ra_deg IS NOT NULL AND dec_deg IS NOT NULL)
            OR (target_kind = 'ephemeris' AND ephemeris IS NOT NULL))
        )
      )
    );
    CREATE INDEX too_requests_pi_idx ON too_requests (pi_user_id, created_at DESC);
    CREATE INDEX too_requests_state_idx ON too_requests (state, submitted_at);

    CREATE TABLE too_request_telescopes (
      request_id uuid NOT NULL REFERENCES too_requests (id) ON DELETE CASCADE,
      telescope_id uuid NOT NULL REFERENCES telescopes (id),
      PRIMARY KEY (request_id, telescope_id)
    );

    CREATE TABLE request_events (
      id bigserial PRIMARY KEY,
      request_id uuid NOT NULL REFERENCES too_requests (id) ON DELETE CASCADE,
      at timestamptz NOT NULL DEFAULT now(),
      actor_user_id uuid REFERENCES users (id),
      -- NULL: the request was created (as a draft, or filed at once through the API).
      from_state text,
      to_state text NOT NULL,
      note text NOT NULL DEFAULT '' CHECK (length(note) <= 2000)
    );
    CREATE INDEX request_events_request_idx ON request_events (request_id, at, id);

    CREATE TABLE attachments (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      request_id uuid NOT NULL REFERENCES too_requests (id) ON DELETE CASCADE,
      kind text NOT NULL CHECK (kind IN ('finding_chart', 'ephemeris', 'justification', 'other')),
      file_name text NOT NULL CHECK (length(file_name) BETWEEN 1 AND 200 AND position('/' in file_name) = 0),
      content_type text NOT NULL,
      size_bytes integer NOT NULL CHECK (size_bytes BETWEEN 1 AND 20971520),
      storage_key text NOT NULL UNIQUE,
      url text NOT NULL,
      uploaded_by uuid NOT NULL REFERENCES users (id),
      created_at timestamptz NOT NULL DEFAULT now()
    );
    CREATE INDEX attachments_request_idx ON attachments (request_id, created_at);

    CREATE TABLE idempotency_keys (
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      key text NOT NULL CHECK (length(key) BETWEEN 1 AND 255),
      request_hash text NOT NULL,
      status_code integer NOT NULL,
      response jsonb NOT NULL,
      created_at timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (user_id, key)
    );
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DROP TABLE IF EXISTS idempotency_keys, attachments, request_events, too_request_telescopes, too_requests;
  `.execute(db);
}
