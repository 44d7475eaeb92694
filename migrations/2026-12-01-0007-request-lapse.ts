import { sql, type Kysely } from "kysely";

// Requests lapse at their deadline: a seventh notice event tells the PI, and a partial
// index keeps the once-a-minute search for overdue requests (and the lazy one before the
// review queue is read) to the few rows still awaiting a decision.
const EVENTS = "'request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled', 'outcome_logged'";

export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    ALTER TABLE notifications DROP CONSTRAINT notifications_event_check;
    ALTER TABLE notifications ADD CONSTRAINT notifications_event_check
      CHECK (event IN (${sql.raw(EVENTS)}, 'request_lapsed'));
    ALTER TABLE notification_preferences DROP CONSTRAINT notification_preferences_event_check;
    ALTER TABLE notification_preferences ADD CONSTRAINT notification_preferences_event_check
      CHECK (event IN (${sql.raw(EVENTS)}, 'request_lapsed'));
    CREATE INDEX too_requests_awaiting_deadline_idx ON too_requests (deadline) WHERE state IN ('submitted', 'in_review');
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DROP INDEX IF EXISTS too_requests_awaiting_deadline_idx;
    DELETE FROM notifications WHERE event = 'request_lapsed';
    DELETE FROM notification_preferences WHERE event = 'request_lapsed';
    ALTER TABLE notifications DROP CONSTRAINT notifications_event_check;
    ALTER TABLE notifications ADD CONSTRAINT notifications_event_check CHECK (event IN (${sql.raw(EVENTS)}));
    ALTER TABLE notification_preferences DROP CONSTRAINT notification_preferences_event_check;
    ALTER TABLE notification_preferences ADD CONSTRAINT notification_preferences_event_check CHECK (event IN (${sql.raw(EVENTS)}));
  `.execute(db);
}
