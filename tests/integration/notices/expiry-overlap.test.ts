// A send that outlives its job's expiry. pg-boss stops waiting for the handler, fails the
// job and hands it out again while the first attempt is still running, so two attempts
// for one e-mail overlap. Whatever order they finish in, an e-mail one of them delivered
// stays recorded as sent, and the job is not left behind.
import { Kysely, PostgresDialect, sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createPool, getDb } from "@/db/index";
import type { Database } from "@/db/types";
import { deliverNoticeJob, RetryableDeliveryError, type DeliveryContext } from "@/lib/notices/deliver";
import { noticeKey } from "@/lib/notices/enqueue";
import { classifySendError, createResendMailer, type Mailer } from "@/lib/notices/mailer";
import { noticeDecisionMade } from "@/lib/notices/notify";
import { closeNoticeQueue, type NoticeJobData } from "@/lib/notices/queue";
import { startNoticeWorker, type NoticeWorker } from "@/lib/notices/worker";
import { decisionMade } from "../../support/notice-payloads";
import { makeUser } from "../fixtures";
import { API_KEY, APP_URL, clearNoticeBacklog, countByKey, describeDeliveries, SETTLE_TIMEOUT_MS, startTestFake, TEST_POLICY, waitFor, waitUntilSettled, type TestFake } from "./helpers";

let fake: TestFake;
let worker: NoticeWorker | undefined;
let workerDb: Kysely<Database> | undefined;

beforeAll(async () => {
  await clearNoticeBacklog();
  fake = await startTestFake();
});

afterAll(async () => {
  await worker?.stop();
  await workerDb?.destroy();
  await closeNoticeQueue();
  await fake.close();
});

const rateLimited = { ok: false, retryable: true, status: 429, message: "429 rate_limit_exceeded: too many requests" } as const;

async function jobState(key: string): Promise<string | undefined> {
  const { rows } = await sql<{ state: string }>`select state::text from pgboss.job where data->>'key' = ${key}`.execute(getDb());
  return rows[0]?.state;
}

async function deliveryStatus(key: string): Promise<string | undefined> {
  const row = await getDb().selectFrom("email_deliveries").select("status").where("idempotency_key", "=", key).executeTakeFirst();
  return row?.status;
}

/** A queued e-mail and its job's data, for calling the delivery step directly (no worker, no job). */
async function queuedDelivery(): Promise<{ key: string; data: NoticeJobData }> {
  const pi = await makeUser(["pi"]);
  const payload = decisionMade({ piUserId: pi.id });
  const key = noticeKey("decision_made", payload.requestId, pi.id);
  await getDb().insertInto("email_deliveries").values({ idempotency_key: key, user_id: pi.id, recipient: pi.email, template: "decision_made" }).execute();
  // As pg-boss hands it over: JSON, instants as ISO strings.
  const data: NoticeJobData = { key, event: "decision_made", to: { userId: pi.id, name: "Fixture PI", email: pi.email }, payload: JSON.parse(JSON.stringify(payload)) };
  return { key, data };
}

describe("two attempts at one e-mail overlap", { timeout: 3 * SETTLE_TIMEOUT_MS }, () => {
  it("through the worker: the retry delivers while the expired attempt hangs; its late failure does not undo the delivery", async () => {
    const pi = await makeUser(["pi"]);
    const payload = decisionMade({ piUserId: pi.id });
    const key = noticeKey("decision_made", payload.requestId, pi.id);

    // Every status the worker writes for this key, in the order its queries finish.
    const writes: string[] = [];
    workerDb = new Kysely<Database>({
      dialect: new PostgresDialect({ pool: createPool(process.env.DATABASE_URL ?? "", TEST_POLICY.concurrency + 2) }),
      log: (event) => {
        const [status] = event.query.parameters;
        if (event.level === "query" && /^update "email_deliveries"/.test(event.query.sql) && event.query.parameters.includes(key)) writes.push(String(status));
      },
    });
    const real = createResendMailer({ apiKey: API_KEY, baseUrl: fake.fake.url, timeoutMs: TEST_POLICY.sendTimeoutMs });
    let calls = 0;
    const mailer: Mailer = {
      async send(email, idempotencyKey) {
        calls += 1;
        if (idempotencyKey !== key || calls > 1) return real.send(email, idempotencyKey);
        // The first attempt hangs past the job's expiry and answers only after the retry
        // has recorded its delivery, with a failure that would ask for yet another try.
        await waitFor("the retry to record the e-mail sent", () => writes.includes("sent"));
        return rateLimited;
      },
    };
    worker = await startNoticeWorker({ policy: TEST_POLICY, appUrl: APP_URL, mailer, db: workerDb });

    await getDb().transaction().execute((trx) => noticeDecisionMade(trx, payload));
    await waitFor("the hung attempt to record its late failure", () => writes.includes("retrying"));
    await waitFor("pg-boss to finish the job", async () => !["created", "retry", "active"].includes((await jobState(key)) ?? "active"));

    // Two attempts, or more if the retry itself was slow enough to expire on a loaded machine.
    expect(calls).toBeGreaterThanOrEqual(2);
    expect(writes.indexOf("sent")).toBeLessThan(writes.lastIndexOf("retrying"));
    const row = await getDb().selectFrom("email_deliveries").select(["status", "attempts", "provider_id", "sent_at"]).where("idempotency_key", "=", key).executeTakeFirstOrThrow();
    expect(row.status, await describeDeliveries([key])).toBe("sent");
    expect(row.attempts).toBe(calls);
    expect(row.provider_id).not.toBeNull();
    expect(row.sent_at).not.toBeNull();
    expect(await jobState(key)).toBe("completed");
    expect(countByKey(await fake.messages(), [key]).get(key)).toBe(1);
  });

  it("at the delivery step: a late success after the last attempt gave up is recorded sent", async () => {
    const { key, data } = await queuedDelivery();

    const real = createResendMailer({ apiKey: API_KEY, baseUrl: fake.fake.url, timeoutMs: TEST_POLICY.sendTimeoutMs });
    let release: () => void = () => undefined;
    const released = new Promise<void>((resolve) => (release = resolve));
    const hanging: Mailer = {
      async send(email, idempotencyKey) {
        await released;
        return real.send(email, idempotencyKey);
      },
    };
    const ctx = (mailer: Mailer): DeliveryContext => ({ db: getDb(), mailer, from: "Nightbreak <desk@nightbreak.test>", appUrl: APP_URL });

    const first = deliverNoticeJob({ data, retryCount: 0, retryLimit: 1 }, ctx(hanging));
    await waitFor("the first attempt to claim the e-mail", async () => (await deliveryStatus(key)) === "sending");
    // The last attempt is refused and gives up while the first is still on the wire.
    await expect(deliverNoticeJob({ data, retryCount: 1, retryLimit: 1 }, ctx({ send: async () => rateLimited }))).rejects.toBeInstanceOf(RetryableDeliveryError);
    expect(await deliveryStatus(key)).toBe("failed");

    release();
    await expect(first).resolves.toBe("sent");
    const statuses = await waitUntilSettled([key]);
    expect(statuses.get(key)).toEqual({ status: "sent", attempts: 2 });
    expect(countByKey(await fake.messages(), [key]).get(key)).toBe(1);
  });

  it("at the delivery step: the mail service's answer to an overlapping send with the same key (409, concurrent) is retried, not given up", async () => {
    const { key, data } = await queuedDelivery();
    // What Resend answers while a request with the same idempotency key is still in progress.
    const concurrent = classifySendError({ statusCode: 409, name: "concurrent_idempotent_requests", message: "Same idempotency key used while original request is still in progress." });
    const ctx: DeliveryContext = { db: getDb(), mailer: { send: async () => concurrent }, from: "Nightbreak <desk@nightbreak.test>", appUrl: APP_URL };

    await expect(deliverNoticeJob({ data, retryCount: 0, retryLimit: 3 }, ctx)).rejects.toBeInstanceOf(RetryableDeliveryError);
    expect(await deliveryStatus(key)).toBe("retrying");
  });
});
