import { sql, type Kysely } from "kysely";

// Telling people: in-app notices, per-user e-mail preferences, and the log of every
// outbound e-mail. A notice and its e-mail share one idempotency key
// (`event:subject:recipient`), unique in both tables, so enqueuing the same notice twice
// is a no-op and a retried send is recognised by the mail service.
// The job queue itself (pg-boss) keeps its own schema, created by pg-boss on start.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    CREATE TABLE notifications (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      event text NOT NULL CHECK (event IN ('request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled')),
      notice_key text NOT NULL UNIQUE,
      title text NOT NULL CHECK (length(title) BETWEEN 1 AND 300),
      body text NOT NULL,
      link text NOT NULL CHECK (link LIKE '/%'),
      created_at timestamptz NOT NULL DEFAULT now(),
      read_at timestamptz
    );
    CREATE INDEX notifications_user_idx ON notifications (user_id, created_at DESC);
    CREATE INDEX notifications_user_unread_idx ON notifications (user_id) WHERE read_at IS NULL;

    CREATE TABLE notification_preferences (
      user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      event text NOT NULL CHECK (event IN ('request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled')),
      email boolean NOT NULL,
      PRIMARY KEY (user_id, event)
    );

    CREATE TABLE email_deliveries (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      idempotency_key text NOT NULL UNIQUE CHECK (length(idempotency_key) BETWEEN 1 AND 256),
      user_id uuid REFERENCES users (id) ON DELETE SET NULL,
      recipient text NOT NULL,
      template text NOT NULL,
      status text NOT NULL DEFAULT 'queued' CHECK (status IN ('queued', 'sending', 'retrying', 'sent', 'failed')),
      attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
      provider_id text,
      last_error text,
      subject text,
      body_html text,
      body_text text,
      created_at timestamptz NOT NULL DEFAULT now(),
      updated_at timestamptz NOT NULL DEFAULT now(),
      sent_at timestamptz
    );
    CREATE INDEX email_deliveries_status_idx ON email_deliveries (status, created_at);
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DROP TABLE IF EXISTS email_deliveries;
    DROP TABLE IF EXISTS notification_preferences;
    DROP TABLE IF EXISTS notifications;
  `.execute(db);
}
