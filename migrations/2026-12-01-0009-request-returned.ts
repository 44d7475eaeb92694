import { sql, type Kysely } from "kysely";

// An eighth notice event: the PI is told when the director returns a request for changes.
// The event name is a CHECK constraint on two tables. This migration reads the names the
// constraint allows now and adds (or, going down, removes) one, rather than repeating the
// list, so an event added by another migration in between is kept either way.
const EVENT = "request_returned";
const TABLES = ["notifications", "notification_preferences"] as const;

async function allowedEvents(db: Kysely<unknown>, table: string): Promise<string[]> {
  const { rows } = await sql<{ definition: string }>`
    SELECT pg_get_constraintdef(oid) AS definition FROM pg_constraint
    WHERE conrelid = ${table}::regclass AND conname = ${`${table}_event_check`}`.execute(db);
  const definition = rows[0]?.definition;
  if (!definition) throw new Error(`${table}_event_check is missing`);
  return [...definition.matchAll(/'([a-z_]+)'/g)].map((m) => m[1] ?? "");
}

async function allowEvents(db: Kysely<unknown>, table: string, events: readonly string[]): Promise<void> {
  const check = sql.id(`${table}_event_check`);
  const list = sql.join(events.map((e) => sql.lit(e)));
  await sql`ALTER TABLE ${sql.table(table)} DROP CONSTRAINT ${check}`.execute(db);
  await sql`ALTER TABLE ${sql.table(table)} ADD CONSTRAINT ${check} CHECK (event IN (${list}))`.execute(db);
}

export async function up(db: Kysely<unknown>): Promise<void> {
  for (const table of TABLES) {
    const events = await allowedEvents(db, table);
    if (!events.includes(EVENT)) await allowEvents(db, table, [...events, EVENT]);
  }
}

export async function down(db: Kysely<unknown>): Promise<void> {
  for (const table of TABLES) {
    await sql`DELETE FROM ${sql.table(table)} WHERE event = ${EVENT}`.execute(db);
    await allowEvents(db, table, (await allowedEvents(db, table)).filter((e) => e !== EVENT));
  }
}
