/**
 * Shared by the notice delivery tests: a fast delivery policy, the in-process e-mail
 * fake, and waiting for the outbox to drain.
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { sql } from "kysely";
import { getDb } from "@/db/index";
import type { DeliveryStatus, Role } from "@/db/types";
import type { DeliveryPolicy } from "@/lib/notices/config";
import { createResendMailer } from "@/lib/notices/mailer";
import { getNoticeQueue, NOTICE_QUEUE } from "@/lib/notices/queue";
import { startNoticeWorker, type NoticeWorker } from "@/lib/notices/worker";
import { startEmailFake, type EmailFake, type EmailFaults, type StoredEmail } from "../../../scripts/fakes/email-server";
import { makeUser } from "../fixtures";

export const APP_URL = "http://127.0.0.1:3999";
export const API_KEY = "re_local_test_key";

// Immediate retries and short expiry keep the suite quick; backoff is pg-boss's own and
// is exercised in production settings only.
export const TEST_POLICY: DeliveryPolicy = {
  retryLimit: 25,
  retryDelaySeconds: 0,
  retryBackoff: false,
  expireInSeconds: 3,
  pollingIntervalSeconds: 0.5,
  maintenanceIntervalSeconds: 1,
  concurrency: 4,
  sendTimeoutMs: 5_000,
};

export function policyEnv(policy: DeliveryPolicy): Record<string, string> {
  return {
    NOTICE_RETRY_LIMIT: String(policy.retryLimit),
    NOTICE_RETRY_DELAY_SECONDS: String(policy.retryDelaySeconds),
    NOTICE_RETRY_BACKOFF: policy.retryBackoff ? "on" : "off",
    NOTICE_EXPIRE_SECONDS: String(policy.expireInSeconds),
    NOTICE_POLL_SECONDS: String(policy.pollingIntervalSeconds),
    NOTICE_MAINTENANCE_SECONDS: String(policy.maintenanceIntervalSeconds),
    NOTICE_CONCURRENCY: String(policy.concurrency),
    NOTICE_SEND_TIMEOUT_MS: String(policy.sendTimeoutMs),
  };
}

// The enqueue side creates the queue with the env policy: make it the test policy too.
Object.assign(process.env, policyEnv(TEST_POLICY));

/**
 * Other test files enqueue notices and never run a worker. Drop that backlog (jobs not yet
 * started) so this file's worker only has its own work and its timing does not depend on
 * which files ran before.
 */
export async function clearNoticeBacklog(): Promise<void> {
  await (await getNoticeQueue()).purgeQueue(NOTICE_QUEUE);
}

export interface TestFake {
  fake: EmailFake;
  close(): Promise<void>;
  setFaults(faults: Partial<EmailFaults>): Promise<void>;
  stats(): Promise<{ requests: number; injectedFailures: number; stored: number; idempotentReplays: number }>;
  messages(): Promise<StoredEmail[]>;
}

export async function startTestFake(faults: Partial<EmailFaults> = {}): Promise<TestFake> {
  const dir = await mkdtemp(join(tmpdir(), "nightbreak-notices-"));
  const fake = await startEmailFake({ port: 0, dir, faults: { failRate: 0, failStatus: 500, failMode: "before-store", ...faults } });
  return {
    fake,
    async close() {
      await fake.close();
      await rm(dir, { recursive: true, force: true });
    },
    async setFaults(next) {
      await fetch(`${fake.url}/_control`, { method: "POST", body: JSON.stringify(next) });
    },
    async stats() {
      const body = (await (await fetch(`${fake.url}/_control`)).json()) as { stats: Awaited<ReturnType<TestFake["stats"]>> };
      return body.stats;
    },
    async messages() {
      return ((await (await fetch(`${fake.url}/_messages`)).json()) as { data: StoredEmail[] }).data;
    },
  };
}

export function startTestWorker(fake: EmailFake, policy: DeliveryPolicy = TEST_POLICY): Promise<NoticeWorker> {
  return startNoticeWorker({ policy, appUrl: APP_URL, mailer: createResendMailer({ apiKey: API_KEY, baseUrl: fake.url, timeoutMs: policy.sendTimeoutMs }) });
}

/**
 * Many users, one at a time. At once, every first call would hash the fixture password
 * (bcrypt, on this thread, before the cache is filled): on a loaded machine that starves
 * the pool's new connections past their 5 s connect timeout.
 */
export async function makeUsers(count: number, roles: Role[]): Promise<Array<{ id: string; email: string }>> {
  const users: Array<{ id: string; email: string }> = [];
  for (let i = 0; i < count; i += 1) users.push(await makeUser(roles));
  return users;
}

export async function deliveryStatuses(keys: readonly string[]): Promise<Map<string, { status: DeliveryStatus; attempts: number }>> {
  const rows = await getDb().selectFrom("email_deliveries").select(["idempotency_key", "status", "attempts"]).where("idempotency_key", "in", keys).execute();
  return new Map(rows.map((r) => [r.idempotency_key, { status: r.status, attempts: r.attempts }]));
}

/**
 * How long a wait on the outbox may take before it fails the test. Far beyond what any
 * run needs (seconds), so that a loaded machine only makes a test slower, never red; a
 * test's own timeout must be longer than the waits it makes.
 */
export const SETTLE_TIMEOUT_MS = 90_000;

/** Polls until `check` holds; fails naming `what` once `timeoutMs` has passed. */
export async function waitFor(what: string, check: () => boolean | Promise<boolean>, timeoutMs = SETTLE_TIMEOUT_MS, intervalMs = 100): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`timed out after ${timeoutMs / 1000} s waiting for ${what}`);
    await new Promise((r) => setTimeout(r, intervalMs));
  }
}

/** Polls until every key is sent or failed (or the time is up, which fails the test). */
export async function waitUntilSettled(keys: readonly string[], timeoutMs = SETTLE_TIMEOUT_MS): Promise<Map<string, { status: DeliveryStatus; attempts: number }>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const statuses = await deliveryStatuses(keys);
    const open = keys.filter((k) => !["sent", "failed"].includes(statuses.get(k)?.status ?? "queued"));
    if (open.length === 0) return statuses;
    if (Date.now() > deadline) throw new Error(`${open.length} of ${keys.length} e-mails still undelivered after ${timeoutMs / 1000} s:\n${await describeDeliveries(open.slice(0, 5))}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** For a failure message: each key's delivery row and its pg-boss job, so a stuck e-mail says why. */
export async function describeDeliveries(keys: readonly string[]): Promise<string> {
  if (keys.length === 0) return "";
  const { rows } = await sql<{ key: string; status: string; attempts: number; last_error: string | null; updated_at: Date; state: string | null; retry_count: number | null; output: unknown }>`
    select d.idempotency_key as key, d.status::text, d.attempts, d.last_error, d.updated_at, j.state::text as state, j.retry_count, j.output
    from email_deliveries d
    left join (select data, state, retry_count, output from pgboss.job union all select data, state, retry_count, output from pgboss.archive) j on j.data->>'key' = d.idempotency_key
    where d.idempotency_key in (${sql.join([...keys])})`.execute(getDb());
  return rows
    .map((r) => `  ${r.key}: ${r.status} after ${r.attempts} attempts (last error: ${r.last_error ?? "none"}, updated ${r.updated_at.toISOString()}); job ${r.state ?? "missing"}, retry ${r.retry_count ?? "-"}, output ${JSON.stringify(r.output)}`)
    .join("\n");
}

/** How many stored messages the fake holds per idempotency key, for the given keys. */
export function countByKey(messages: StoredEmail[], keys: readonly string[]): Map<string, number> {
  const wanted = new Set(keys);
  const counts = new Map<string, number>();
  for (const m of messages) {
    if (m.idempotency_key && wanted.has(m.idempotency_key)) counts.set(m.idempotency_key, (counts.get(m.idempotency_key) ?? 0) + 1);
  }
  return counts;
}
