// When the mail service keeps failing, the worker retries up to the limit, then records
// the e-mail as failed with the last error (and keeps what it tried to send).
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { noticeKey } from "@/lib/notices/enqueue";
import { noticeDecisionMade } from "@/lib/notices/notify";
import { closeNoticeQueue } from "@/lib/notices/queue";
import type { NoticeWorker } from "@/lib/notices/worker";
import { decisionMade } from "../../support/notice-payloads";
import { makeUser } from "../fixtures";
import { clearNoticeBacklog, SETTLE_TIMEOUT_MS, startTestFake, startTestWorker, TEST_POLICY, waitFor, waitUntilSettled, type TestFake } from "./helpers";

let fake: TestFake;
let worker: NoticeWorker;

beforeAll(async () => {
  await clearNoticeBacklog();
  fake = await startTestFake({ failRate: 1, failStatus: 500 });
  worker = await startTestWorker(fake.fake, { ...TEST_POLICY, retryLimit: 2 });
});

afterAll(async () => {
  await worker.stop();
  await closeNoticeQueue();
  await fake.close();
});

describe("a mail service that never recovers", () => {
  it("tries 1 + retryLimit times, then marks the e-mail failed", async () => {
    const pi = await makeUser(["pi"]);
    const payload = decisionMade({ piUserId: pi.id });
    await getDb().transaction().execute((trx) => noticeDecisionMade(trx, payload));
    const key = noticeKey("decision_made", payload.requestId, pi.id);

    const statuses = await waitUntilSettled([key]);
    expect(statuses.get(key)).toEqual({ status: "failed", attempts: 3 });
    const row = await getDb().selectFrom("email_deliveries").select(["last_error", "subject", "sent_at"]).where("idempotency_key", "=", key).executeTakeFirstOrThrow();
    expect(row.last_error).toMatch(/^500 internal_server_error/);
    expect(row.subject).toMatch(/was approved$/);
    expect(row.sent_at).toBeNull();

    // pg-boss agrees: the job ended failed, not completed (it hears so just after the row is written).
    const jobStates = async () => (await sql<{ state: string }>`select state::text from pgboss.job where data->>'key' = ${key}`.execute(getDb())).rows.map((r) => r.state);
    await waitFor("pg-boss to end the job", async () => (await jobStates()).every((s) => !["created", "retry", "active"].includes(s)));
    expect(await jobStates()).toEqual(["failed"]);
    expect((await fake.messages()).filter((m) => m.idempotency_key === key)).toEqual([]);
  }, 2 * SETTLE_TIMEOUT_MS + 30_000);
});
