/**
 * The mail service down (the e-mail fake stopped: connections refused) while notices are
 * caused: nothing is lost and nothing is given up. Every e-mail waits in the outbox as
 * `retrying` with a plain last error, which the admin outbox page shows; pg-boss keeps
 * the jobs for another try. When the service comes back on the same address, the worker
 * (never restarted) delivers each e-mail exactly once.
 *
 * The upload service down is covered in tests/unit/attachments/upload-router.test.ts
 * ("when the upload service is down"): a clear message, nothing recorded, the form's
 * values untouched (components/requests/use-attachment-upload.ts).
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { policyFromEnv, type DeliveryPolicy } from "@/lib/notices/config";
import { countDeliveriesByStatus, listRecentDeliveries } from "@/lib/notices/deliveries";
import { noticeKey } from "@/lib/notices/enqueue";
import { createResendMailer } from "@/lib/notices/mailer";
import { noticeBlockDisplaced, noticeDecisionMade, noticePaybackScheduled } from "@/lib/notices/notify";
import { closeNoticeQueue, ensureQueue, getNoticeQueue } from "@/lib/notices/queue";
import { startNoticeWorker, type NoticeWorker } from "@/lib/notices/worker";
import { startEmailFake, type EmailFake } from "../../../scripts/fakes/email-server";
import { blockDisplaced, decisionMade, paybackScheduled } from "../../support/notice-payloads";
import { makeUser } from "../fixtures";
import { API_KEY, APP_URL, clearNoticeBacklog, countByKey, deliveryStatuses, SETTLE_TIMEOUT_MS, TEST_POLICY, waitFor, waitUntilSettled } from "../notices/helpers";

// A retry a second apart, and plenty of them: the outage must not use them all up.
const OUTAGE_POLICY: DeliveryPolicy = { ...TEST_POLICY, retryLimit: 60, retryDelaySeconds: 1, retryBackoff: false };

let dir: string;
let port: number;
let fake: EmailFake | null = null;
let worker: NoticeWorker;

beforeAll(async () => {
  await clearNoticeBacklog();
  dir = await mkdtemp(join(tmpdir(), "nightbreak-mail-outage-"));
  fake = await startEmailFake({ port: 0, dir, faults: { failRate: 0 } });
  port = fake.port;
  // The worker updates the queue's retry policy, so the jobs queued below get this one.
  worker = await startNoticeWorker({
    policy: OUTAGE_POLICY,
    appUrl: APP_URL,
    mailer: createResendMailer({ apiKey: API_KEY, baseUrl: fake.url, timeoutMs: OUTAGE_POLICY.sendTimeoutMs }),
  });
});

afterAll(async () => {
  await worker.stop();
  // Leave the queue's retry policy as the other test files expect it (helpers.ts sets the env).
  await ensureQueue(await getNoticeQueue(), policyFromEnv(), true);
  await closeNoticeQueue();
  await fake?.close();
  await rm(dir, { recursive: true, force: true });
});

async function jobStates(keys: readonly string[]): Promise<string[]> {
  const { rows } = await sql<{ state: string }>`select state::text from pgboss.job where data->>'key' in (${sql.join([...keys])})`.execute(getDb());
  return rows.map((r) => r.state);
}

describe("the mail service down while notices are caused", () => {
  it("keeps every e-mail for retry with a clear error, then delivers each exactly once when it is back", async () => {
    await fake?.close();
    fake = null;

    const pis = await Promise.all([1, 2, 3].map(() => makeUser(["pi"])));
    const observers = await Promise.all([1, 2, 3].map(() => makeUser(["observer"])));
    const decisions = pis.map((p) => decisionMade({ piUserId: p.id }));
    const displaced = observers.map((o) => blockDisplaced({ observerUserId: o.id }));
    const paybacks = observers.map((o) => paybackScheduled({ observerUserId: o.id }));
    await getDb()
      .transaction()
      .execute(async (trx) => {
        for (const p of decisions) await noticeDecisionMade(trx, p);
        for (const p of displaced) await noticeBlockDisplaced(trx, p);
        for (const p of paybacks) await noticePaybackScheduled(trx, p);
      });
    const keys = [
      ...decisions.map((p) => noticeKey("decision_made", p.requestId, p.piUserId)),
      ...displaced.map((p) => noticeKey("block_displaced", p.displacementId, p.observerUserId)),
      ...paybacks.map((p) => noticeKey("payback_scheduled", p.paybackBlockId, p.observerUserId)),
    ];
    expect(new Set(keys).size).toBe(9);

    // Down: each e-mail tried at least twice, none sent, none given up.
    await waitFor("every e-mail to have been tried twice", async () => {
      const statuses = await deliveryStatuses(keys);
      return keys.every((k) => (statuses.get(k)?.attempts ?? 0) >= 2);
    });
    const whileDown = await deliveryStatuses(keys);
    expect([...whileDown.values()].filter((s) => s.status === "sent" || s.status === "failed")).toEqual([]);
    expect(await jobStates(keys)).toHaveLength(9);
    expect((await jobStates(keys)).filter((s) => !["created", "retry", "active"].includes(s))).toEqual([]);

    // What the admin outbox page shows: the e-mails waiting, each with why.
    const counts = await countDeliveriesByStatus(getDb());
    expect(counts.retrying + counts.sending).toBeGreaterThanOrEqual(9);
    const log = (await listRecentDeliveries(getDb(), 500)).filter((d) => keys.includes(d.key));
    expect(log).toHaveLength(9);
    for (const entry of log) {
      expect(entry.sentAt).toBeNull();
      // A network failure, said as such ("network application_error: Unable to fetch data…"):
      // retryable, nothing like a refusal of the message.
      if (entry.status === "retrying") expect(entry.lastError).toMatch(/^network \w+: \S/);
    }
    expect(log.filter((d) => d.status === "retrying").length).toBeGreaterThan(0);

    // Back, on the same address, with the same storage: the same worker catches up.
    fake = await startEmailFake({ port, dir, faults: { failRate: 0 } });
    const settled = await waitUntilSettled(keys);
    expect([...settled.values()].filter((s) => s.status !== "sent")).toEqual([]);
    expect([...settled.values()].every((s) => s.attempts >= 3)).toBe(true);

    const messages = (await (await fetch(`${fake.url}/_messages`)).json()) as { data: Parameters<typeof countByKey>[0] };
    const perKey = countByKey(messages.data, keys);
    expect(perKey.size).toBe(9);
    expect([...perKey.values()].filter((n) => n !== 1)).toEqual([]);
    await waitFor("pg-boss to record every job completed", async () => (await jobStates(keys)).every((s) => s === "completed"));
  }, 3 * SETTLE_TIMEOUT_MS + 30_000);
});
