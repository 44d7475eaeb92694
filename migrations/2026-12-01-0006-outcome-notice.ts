import { sql, type Kysely } from "kysely";

// A sixth notice event: the PI is told the logged outcome of their ToO block (executed,
// partially executed, or lost to weather, a fault or an abort). Only the two CHECK
// constraints on the event name change; Postgres named them when 0003 created the tables.
export async function up(db: Kysely<unknown>): Promise<void> {
  await sql`
    ALTER TABLE notifications DROP CONSTRAINT notifications_event_check;
    ALTER TABLE notifications ADD CONSTRAINT notifications_event_check
      CHECK (event IN ('request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled', 'outcome_logged'));
    ALTER TABLE notification_preferences DROP CONSTRAINT notification_preferences_event_check;
    ALTER TABLE notification_preferences ADD CONSTRAINT notification_preferences_event_check
      CHECK (event IN ('request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled', 'outcome_logged'));
  `.execute(db);
}

export async function down(db: Kysely<unknown>): Promise<void> {
  await sql`
    DELETE FROM notifications WHERE event = 'outcome_logged';
    DELETE FROM notification_preferences WHERE event = 'outcome_logged';
    ALTER TABLE notifications DROP CONSTRAINT notifications_event_check;
    ALTER TABLE notifications ADD CONSTRAINT notifications_event_check
      CHECK (event IN ('request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled'));
    ALTER TABLE notification_preferences DROP CONSTRAINT notification_preferences_event_check;
    ALTER TABLE notification_preferences ADD CONSTRAINT notification_preferences_event_check
      CHECK (event IN ('request_submitted', 'decision_made', 'block_displaced', 'tonight_changed', 'payback_scheduled'));
  `.execute(db);
}
