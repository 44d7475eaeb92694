/**
 * The durable outbox is a pg-boss queue in the same PostgreSQL database (schema `pgboss`,
 * created by pg-boss itself on start). Jobs are inserted through the caller's Kysely
 * transaction, so they exist exactly when the change that caused them commits.
 */
import { CompiledQuery } from "kysely";
import PgBoss from "pg-boss";
import type { Trx } from "@/db/index";
import type { NoticeEvent } from "@/db/types";
import { policyFromEnv, type DeliveryPolicy } from "./config";

export const NOTICE_QUEUE = "notice-email";
export const BOSS_SCHEMA = "pgboss";
/** NOTIFY channel: a committed enqueue wakes idle workers at once instead of at the next poll. */
export const WAKE_CHANNEL = "nightbreak_notices";

/** One e-mail to one person. The payload is the event's payload as JSON (instants as ISO strings). */
export interface NoticeJobData {
  key: string;
  event: NoticeEvent;
  to: { userId: string; name: string; email: string };
  payload: unknown;
}

export function bossOptions(connectionString: string, extra: PgBoss.ConstructorOptions = {}): PgBoss.ConstructorOptions {
  return { connectionString, schema: BOSS_SCHEMA, migrate: true, schedule: false, ...extra };
}

/** pg-boss runs its SQL through this to join the caller's transaction. */
export function transactionAdapter(trx: Trx): PgBoss.Db {
  return {
    async executeSql(text: string, values: unknown[]) {
      const result = await trx.executeQuery(CompiledQuery.raw(text, values));
      return { rows: [...result.rows] };
    },
  };
}

/** Creates the queue when missing; a worker also updates it so new jobs get its retry policy. */
export async function ensureQueue(boss: PgBoss, policy: DeliveryPolicy, update = false): Promise<void> {
  const options: PgBoss.Queue = {
    name: NOTICE_QUEUE,
    retryLimit: policy.retryLimit,
    retryDelay: policy.retryDelaySeconds,
    retryBackoff: policy.retryBackoff,
    expireInSeconds: policy.expireInSeconds,
  };
  await boss.createQueue(NOTICE_QUEUE, options);
  if (update) await boss.updateQueue(NOTICE_QUEUE, options);
}

// One small, started instance per process for enqueuing (kept across dev hot reloads).
const holder = globalThis as unknown as { nightbreakNoticeQueue?: Promise<PgBoss> };

async function openQueue(): Promise<PgBoss> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: notices cannot be queued");
  const boss = new PgBoss(bossOptions(url, { max: 2, supervise: false, application_name: "nightbreak-enqueue" }));
  boss.on("error", (error) => console.error("notice queue:", error.message));
  await boss.start();
  await ensureQueue(boss, policyFromEnv());
  return boss;
}

export function getNoticeQueue(): Promise<PgBoss> {
  holder.nightbreakNoticeQueue ??= openQueue().catch((error: unknown) => {
    holder.nightbreakNoticeQueue = undefined;
    throw error;
  });
  return holder.nightbreakNoticeQueue;
}

/** For tests and scripts that end: closes the enqueue instance's pool. */
export async function closeNoticeQueue(): Promise<void> {
  const pending = holder.nightbreakNoticeQueue;
  holder.nightbreakNoticeQueue = undefined;
  if (pending) await (await pending).stop({ graceful: false, wait: true });
}
