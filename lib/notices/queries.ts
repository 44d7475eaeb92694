/**
 * A person's own notices and e-mail preferences. Every function takes the user's id and
 * filters by it, so no query here can reach somebody else's rows.
 */
import { sql } from "kysely";
import type { Db } from "@/db/index";
import { NOTICE_EVENTS, type NoticeEvent } from "@/db/types";

export interface Notice {
  id: string;
  event: NoticeEvent;
  title: string;
  body: string;
  link: string;
  createdAt: Date;
  readAt: Date | null;
}

export async function listNoticesForUser(db: Db, userId: string, opts: { limit?: number; unreadOnly?: boolean } = {}): Promise<Notice[]> {
  let query = db
    .selectFrom("notifications")
    .select(["id", "event", "title", "body", "link", "created_at", "read_at"])
    .where("user_id", "=", userId)
    .orderBy("created_at", "desc")
    .orderBy("id")
    .limit(opts.limit ?? 50);
  if (opts.unreadOnly) query = query.where("read_at", "is", null);
  const rows = await query.execute();
  return rows.map((r) => ({ id: r.id, event: r.event, title: r.title, body: r.body, link: r.link, createdAt: r.created_at, readAt: r.read_at }));
}

export async function countUnreadNotices(db: Db, userId: string): Promise<number> {
  const { n } = await db
    .selectFrom("notifications")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("user_id", "=", userId)
    .where("read_at", "is", null)
    .executeTakeFirstOrThrow();
  return Number(n);
}

/** True when the notice is the user's own (read before or now). */
export async function markNoticeRead(db: Db, userId: string, noticeId: string): Promise<boolean> {
  const row = await db
    .updateTable("notifications")
    .set({ read_at: sql`coalesce(read_at, now())` })
    .where("id", "=", noticeId)
    .where("user_id", "=", userId)
    .returning("id")
    .executeTakeFirst();
  return row !== undefined;
}

export async function markAllNoticesRead(db: Db, userId: string): Promise<number> {
  const result = await db.updateTable("notifications").set({ read_at: sql`now()` }).where("user_id", "=", userId).where("read_at", "is", null).executeTakeFirst();
  return Number(result.numUpdatedRows);
}

export type EmailPreferences = Record<NoticeEvent, boolean>;

/** E-mail is on for every event unless the person turned it off. */
export async function getEmailPreferences(db: Db, userId: string): Promise<EmailPreferences> {
  const rows = await db.selectFrom("notification_preferences").select(["event", "email"]).where("user_id", "=", userId).execute();
  const prefs = Object.fromEntries(NOTICE_EVENTS.map((e) => [e, true])) as EmailPreferences;
  for (const r of rows) prefs[r.event] = r.email;
  return prefs;
}

export async function setEmailPreferences(db: Db, userId: string, prefs: Partial<EmailPreferences>): Promise<void> {
  const values = Object.entries(prefs).map(([event, email]) => ({ user_id: userId, event: event as NoticeEvent, email: email === true }));
  if (values.length === 0) return;
  await db
    .insertInto("notification_preferences")
    .values(values)
    .onConflict((oc) => oc.columns(["user_id", "event"]).doUpdateSet((eb) => ({ email: eb.ref("excluded.email") })))
    .execute();
}
