/**
 * Delivering one queued e-mail. Safe to run twice for the same job (a worker that died
 * mid-send, a job that expired while still running): a sent row is skipped, the
 * idempotency key makes the mail service answer a repeated send with the first message,
 * and when two attempts overlap, the one that finishes last cannot undo a delivery the
 * other recorded (`recordDelivery`).
 */
import { z } from "zod";
import type { Db } from "@/db/index";
import { NOTICE_EVENTS } from "@/db/types";
import { claimDelivery, recordDelivery } from "./deliveries";
import { parseNotice, type NoticeOf } from "./events";
import type { Mailer } from "./mailer";
import type { NoticeJobData } from "./queue";
import { renderNoticeEmail, replyToFor, type RenderedEmail } from "./render";

export interface DeliveryContext {
  db: Db;
  mailer: Mailer;
  from: string;
  appUrl: string;
}

export interface DeliveryJob {
  data: unknown;
  /** Retries already made (0 on the first attempt) and the most allowed. */
  retryCount: number;
  retryLimit: number;
}

/** `skipped`: another attempt at the same e-mail had already sent it or given up. */
export type DeliveryResult = "sent" | "skipped" | "failed";

/** Thrown so that pg-boss schedules a retry with backoff. */
export class RetryableDeliveryError extends Error {}

const jobDataSchema = z.object({
  key: z.string().min(1).max(256),
  event: z.enum(NOTICE_EVENTS),
  to: z.object({ userId: z.string(), name: z.string(), email: z.string() }),
  payload: z.unknown(),
}) satisfies z.ZodType<NoticeJobData>;

function readNotice(data: NoticeJobData): NoticeOf | null {
  try {
    return parseNotice(data.event, data.payload);
  } catch {
    return null;
  }
}

const errorText = (error: unknown) => (error instanceof Error ? error.message : String(error)).slice(0, 1000);

export async function deliverNoticeJob(job: DeliveryJob, ctx: DeliveryContext): Promise<DeliveryResult> {
  const parsed = jobDataSchema.safeParse(job.data);
  if (!parsed.success) return "failed"; // no key to record against; nothing a retry could fix
  const data = parsed.data;

  const claimed = await claimDelivery(ctx.db, data.key);
  if (!claimed) return "skipped";

  const notice = readNotice(data);
  if (!notice) {
    await recordDelivery(ctx.db, data.key, { status: "failed", error: "the queued payload does not match its event" }, null);
    return "failed";
  }
  const lastAttempt = job.retryCount >= job.retryLimit;

  let rendered: RenderedEmail;
  try {
    rendered = claimed.rendered ?? (await renderNoticeEmail(notice, { recipientName: data.to.name, appUrl: ctx.appUrl }));
  } catch (error) {
    // A template fault: retried like a send failure, since a fixed deployment can still deliver it.
    const recorded = await recordDelivery(ctx.db, data.key, { status: lastAttempt ? "failed" : "retrying", error: `rendering: ${errorText(error)}` }, null);
    if (!recorded) return "skipped"; // another attempt settled it meanwhile
    throw error;
  }

  const outcome = await ctx.mailer.send(
    {
      from: ctx.from,
      to: data.to.email,
      subject: rendered.subject,
      html: rendered.html,
      text: rendered.text,
      replyTo: replyToFor(notice),
      tags: [{ name: "event", value: data.event }],
    },
    data.key,
  );
  if (outcome.ok) {
    await recordDelivery(ctx.db, data.key, { status: "sent", providerId: outcome.providerId }, null);
    return "sent";
  }
  if (!outcome.retryable || lastAttempt) {
    // Kept for the log: what was refused.
    const recorded = await recordDelivery(ctx.db, data.key, { status: "failed", error: outcome.message }, rendered);
    if (!recorded) return "skipped"; // another attempt settled it meanwhile
    if (outcome.retryable) throw new RetryableDeliveryError(`gave up after ${claimed.attempts} attempts: ${outcome.message}`);
    return "failed";
  }
  // Kept so the retry sends these very bytes, even if the templates change in between.
  const recorded = await recordDelivery(ctx.db, data.key, { status: "retrying", error: outcome.message }, rendered);
  // Another attempt delivered it (or gave up) meanwhile: there is nothing left to retry.
  if (!recorded) return "skipped";
  throw new RetryableDeliveryError(outcome.message);
}
