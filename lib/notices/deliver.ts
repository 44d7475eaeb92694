/**
 * Delivering one queued e-mail. Safe to run twice for the same job (a worker that died
 * mid-send, a job that expired while still running): a sent row is skipped, and the
 * idempotency key makes the mail service answer a repeated send with the first message.
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
    await recordDelivery(ctx.db, data.key, { status: lastAttempt ? "failed" : "retrying", error: `rendering: ${errorText(error)}` }, null);
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
    await recordDelivery(ctx.db, data.key, { status: "failed", error: outcome.message }, rendered);
    if (outcome.retryable) throw new RetryableDeliveryError(`gave up after ${claimed.attempts} attempts: ${outcome.message}`);
    return "failed";
  }
  // Kept so the retry sends these very bytes, even if the templates change in between.
  await recordDelivery(ctx.db, data.key, { status: "retrying", error: outcome.message }, rendered);
  throw new RetryableDeliveryError(outcome.message);
}
