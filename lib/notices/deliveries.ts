/**
 * The outbound e-mail log, one row per idempotency key. The row is written with the
 * notice (status `queued`); the worker moves it through `sending` and `retrying` to
 * `sent` or `failed`, counting attempts. A failed attempt keeps its rendering so every
 * retry sends the same subject and bodies.
 */
import { sql } from "kysely";
import type { Db } from "@/db/index";
import type { DeliveryStatus, NoticeEvent } from "@/db/types";
import type { RenderedEmail } from "./render";

export interface ClaimedDelivery {
  attempts: number;
  rendered: RenderedEmail | null;
}

/** Marks an attempt; undefined when the e-mail is already sent or given up (a duplicate job). */
export async function claimDelivery(db: Db, key: string): Promise<ClaimedDelivery | undefined> {
  const row = await db
    .updateTable("email_deliveries")
    .set({ status: "sending", attempts: sql`attempts + 1`, updated_at: sql`now()` })
    .where("idempotency_key", "=", key)
    .where("status", "in", ["queued", "sending", "retrying"])
    .returning(["attempts", "subject", "body_html", "body_text"])
    .executeTakeFirst();
  if (!row) return undefined;
  const rendered = row.subject !== null && row.body_html !== null && row.body_text !== null ? { subject: row.subject, html: row.body_html, text: row.body_text } : null;
  return { attempts: row.attempts, rendered };
}

type Outcome =
  | { status: "sent"; providerId: string }
  | { status: "retrying" | "failed"; error: string };

/**
 * Records one attempt's outcome; false when the e-mail was already settled by another.
 * Two attempts at one e-mail can overlap (pg-boss hands a job out again once it expires,
 * even while the first attempt is still sending) and finish in either order. A delivery,
 * once recorded, stands: a late failure from the overtaken attempt must not turn it back
 * into `retrying` (no job is left to retry it) or `failed`. A late delivery still
 * replaces a give-up, because the message did arrive.
 */
export async function recordDelivery(db: Db, key: string, outcome: Outcome, rendered: RenderedEmail | null): Promise<boolean> {
  const result = await db
    .updateTable("email_deliveries")
    .set({
      status: outcome.status,
      provider_id: outcome.status === "sent" ? outcome.providerId : null,
      last_error: outcome.status === "sent" ? null : outcome.error,
      sent_at: outcome.status === "sent" ? sql`now()` : null,
      updated_at: sql`now()`,
      subject: sql`coalesce(subject, ${rendered?.subject ?? null})`,
      body_html: sql`coalesce(body_html, ${rendered?.html ?? null})`,
      body_text: sql`coalesce(body_text, ${rendered?.text ?? null})`,
    })
    .where("idempotency_key", "=", key)
    .where("status", "not in", outcome.status === "sent" ? ["sent"] : ["sent", "failed"])
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}

export interface DeliveryLogEntry {
  key: string;
  recipient: string;
  template: NoticeEvent;
  status: DeliveryStatus;
  attempts: number;
  providerId: string | null;
  lastError: string | null;
  createdAt: Date;
  sentAt: Date | null;
}

export async function listRecentDeliveries(db: Db, limit = 100): Promise<DeliveryLogEntry[]> {
  const rows = await db
    .selectFrom("email_deliveries")
    .select(["idempotency_key", "recipient", "template", "status", "attempts", "provider_id", "last_error", "created_at", "sent_at"])
    .orderBy("created_at", "desc")
    .limit(limit)
    .execute();
  return rows.map((r) => ({
    key: r.idempotency_key,
    recipient: r.recipient,
    template: r.template,
    status: r.status,
    attempts: r.attempts,
    providerId: r.provider_id,
    lastError: r.last_error,
    createdAt: r.created_at,
    sentAt: r.sent_at,
  }));
}

export async function countDeliveriesByStatus(db: Db): Promise<Record<DeliveryStatus, number>> {
  const rows = await db.selectFrom("email_deliveries").select(["status", (eb) => eb.fn.countAll<number>().as("n")]).groupBy("status").execute();
  const counts: Record<DeliveryStatus, number> = { queued: 0, sending: 0, retrying: 0, sent: 0, failed: 0 };
  for (const r of rows) counts[r.status] = Number(r.n);
  return counts;
}
