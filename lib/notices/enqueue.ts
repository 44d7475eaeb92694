/**
 * The one way in: write the in-app notices and queue the e-mails inside the caller's
 * transaction. If that transaction rolls back, no notice row, no delivery row and no
 * job remain, so nothing is ever sent for a change that did not happen.
 */
import { sql } from "kysely";
import type { Trx } from "@/db/index";
import type { NoticeEvent } from "@/db/types";
import { describeNotice } from "./describe";
import { parseNotice, type NoticeOf } from "./events";
import { findRecipients } from "./recipients";
import { getNoticeQueue, NOTICE_QUEUE, transactionAdapter, WAKE_CHANNEL, type NoticeJobData } from "./queue";

/** Deterministic, so the same notice enqueued twice (or a retried send) is recognised. */
export function noticeKey(event: NoticeEvent, subjectId: string, recipientId: string): string {
  return `${event}:${subjectId}:${recipientId}`;
}

export type NoticeRequest = NoticeOf & {
  /** The thing the notice is about (request, displacement, change, payback block). */
  subjectId: string;
  recipientIds: readonly string[];
};

export interface EnqueueResult {
  /** In-app notices written (recipients already told about this subject are skipped). */
  notices: number;
  /** E-mails queued. */
  emails: number;
}

export class NoticeQueueError extends Error {}

// One wake-up per transaction is enough, however many notices it enqueues.
const woken = new WeakSet<Trx>();

export async function enqueueNotice(trx: Trx, request: NoticeRequest): Promise<EnqueueResult> {
  // Validate (and normalise) here, so a caller's mistake rolls its own transaction back.
  const notice = parseNotice(request.event, request.payload);
  const recipients = await findRecipients(trx, [...new Set(request.recipientIds)], notice.event);
  if (recipients.length === 0) return { notices: 0, emails: 0 };

  const text = describeNotice(notice);
  const keyOf = (userId: string) => noticeKey(notice.event, request.subjectId, userId);
  const written = await trx
    .insertInto("notifications")
    .values(recipients.map((r) => ({ user_id: r.userId, event: notice.event, notice_key: keyOf(r.userId), ...text })))
    .onConflict((oc) => oc.column("notice_key").doNothing())
    .returning("notice_key")
    .execute();
  const fresh = new Set(written.map((w) => w.notice_key));

  const mailable = recipients.filter((r) => r.active && r.wantsEmail && r.email !== "" && fresh.has(keyOf(r.userId)));
  if (mailable.length === 0) return { notices: written.length, emails: 0 };

  const logged = await trx
    .insertInto("email_deliveries")
    .values(mailable.map((r) => ({ idempotency_key: keyOf(r.userId), user_id: r.userId, recipient: r.email, template: notice.event })))
    .onConflict((oc) => oc.column("idempotency_key").doNothing())
    .returning("idempotency_key")
    .execute();
  const toQueue = new Set(logged.map((l) => l.idempotency_key));

  const boss = await getNoticeQueue();
  const db = transactionAdapter(trx);
  for (const r of mailable) {
    const key = keyOf(r.userId);
    if (!toQueue.has(key)) continue;
    const data: NoticeJobData = { key, event: notice.event, to: { userId: r.userId, name: r.name, email: r.email }, payload: notice.payload };
    const id = await boss.send(NOTICE_QUEUE, data, { db });
    // pg-boss answers null (and inserts nothing) when the queue is missing: never lose that silently.
    if (!id) throw new NoticeQueueError(`the notice queue did not accept the e-mail ${key}`);
  }
  // Delivered at commit, and only then: idle workers wake without waiting for their next poll.
  if (!woken.has(trx)) {
    woken.add(trx);
    await sql`select pg_notify(${WAKE_CHANNEL}, '')`.execute(trx);
  }
  return { notices: written.length, emails: toQueue.size };
}
