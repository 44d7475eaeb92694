import { sql, type Kysely } from "kysely";

// Subscribable iCalendar feeds: one secret token per feed, stored hashed, revocable.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    CREATE TABLE calendar_feeds (
      id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      owner_user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
      scope text NOT NULL CHECK (scope IN ('telescope', 'program', 'observer')),
      scope_id uuid NOT NULL,
      token_hash text NOT NULL UNIQUE,
      created_at timestamptz NOT NULL DEFAULT now(),
      revoked_at timestamptz
    );
    CREATE INDEX calendar_feeds_owner_idx ON calendar_feeds (owner_user_id);
    CREATE INDEX blocks_telescope_starts_idx ON blocks (telescope_id, starts_at);
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DROP INDEX IF EXISTS blocks_telescope_starts_idx;
    DROP TABLE IF EXISTS calendar_feeds;
  `.execute(db);
}
