// Enqueuing inside the caller's transaction: in-app rows, one e-mail per recipient,
// preferences respected, duplicates ignored, and nothing at all after a rollback.
import { randomUUID } from "node:crypto";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { noticeKey } from "@/lib/notices/enqueue";
import { noticeBlockDisplaced, noticeDecisionMade, noticeRequestSubmitted, noticeTonightChanged } from "@/lib/notices/notify";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { setEmailPreferences } from "@/lib/notices/queries";
import type { NoticeWorker } from "@/lib/notices/worker";
import { Resend } from "resend";
import { blockDisplaced, decisionMade, requestSubmitted, tonightChanged } from "../../support/notice-payloads";
import { makeTelescopeAndProgram, makeUser } from "../fixtures";
import { API_KEY, APP_URL, clearNoticeBacklog, countByKey, SETTLE_TIMEOUT_MS, startTestFake, startTestWorker, waitUntilSettled, type TestFake } from "./helpers";

let fake: TestFake;
let worker: NoticeWorker;

beforeAll(async () => {
  await clearNoticeBacklog();
  fake = await startTestFake();
  worker = await startTestWorker(fake.fake);
});

afterAll(async () => {
  await worker.stop();
  await closeNoticeQueue();
  await fake.close();
});

async function jobsWithKey(key: string): Promise<number> {
  const { rows } = await sql<{ n: string }>`select count(*) as n from pgboss.job where data->>'key' = ${key}`.execute(getDb());
  return Number(rows[0]?.n ?? 0);
}

// Several tests wait for the worker to deliver: give them longer than that wait may take.
describe("enqueueing notices", { timeout: SETTLE_TIMEOUT_MS + 30_000 }, () => {
  it("tells every director in-app, e-mails those who want it, and links to the review", async () => {
    const [a, b, quiet] = await Promise.all([makeUser(["director"]), makeUser(["director"]), makeUser(["director"])]);
    await setEmailPreferences(getDb(), quiet.id, { request_submitted: false });
    const payload = requestSubmitted();
    const result = await getDb().transaction().execute((trx) => noticeRequestSubmitted(trx, payload));
    expect(result.notices).toBeGreaterThanOrEqual(3);

    const mine = await getDb().selectFrom("notifications").selectAll().where("user_id", "in", [a.id, b.id, quiet.id]).where("event", "=", "request_submitted").execute();
    expect(mine).toHaveLength(3);
    expect(mine[0]).toMatchObject({ link: `/review/${payload.requestId}`, read_at: null });

    const keys = [a.id, b.id].map((id) => noticeKey("request_submitted", payload.requestId, id));
    const statuses = await waitUntilSettled(keys);
    expect([...statuses.values()].map((s) => s.status)).toEqual(["sent", "sent"]);
    expect(await getDb().selectFrom("email_deliveries").select("id").where("idempotency_key", "=", noticeKey("request_submitted", payload.requestId, quiet.id)).execute()).toEqual([]);

    const messages = await fake.messages();
    const toA = messages.find((m) => m.idempotency_key === keys[0]);
    expect(toA?.to).toEqual([a.email]);
    expect(toA?.subject).toContain("ToO request for");
    expect(toA?.html).toContain(`${APP_URL}/review/${payload.requestId}`);
  });

  it("tells the night assistants of the telescope, and only them", async () => {
    const { telescopeId } = await makeTelescopeAndProgram();
    const [na, other] = await Promise.all([makeUser(["night_assistant"]), makeUser(["night_assistant"])]);
    await getDb().insertInto("telescope_assistants").values({ telescope_id: telescopeId, user_id: na.id }).execute();
    const payload = tonightChanged({ telescopeId });
    const result = await getDb().transaction().execute((trx) => noticeTonightChanged(trx, payload));
    expect(result).toEqual({ notices: 1, emails: 1 });
    const rows = await getDb().selectFrom("notifications").select("user_id").where("notice_key", "like", `tonight_changed:${payload.changeId}:%`).execute();
    expect(rows.map((r) => r.user_id)).toEqual([na.id]);
    expect(rows.map((r) => r.user_id)).not.toContain(other.id);
  });

  it("ignores the same notice enqueued twice: one notice, one e-mail", async () => {
    const observer = await makeUser(["observer"]);
    const payload = blockDisplaced({ observerUserId: observer.id });
    const first = await getDb().transaction().execute((trx) => noticeBlockDisplaced(trx, payload));
    const second = await getDb().transaction().execute((trx) => noticeBlockDisplaced(trx, payload));
    expect(first).toEqual({ notices: 1, emails: 1 });
    expect(second).toEqual({ notices: 0, emails: 0 });
    const key = noticeKey("block_displaced", payload.displacementId, observer.id);
    await waitUntilSettled([key]);
    expect(await jobsWithKey(key)).toBe(1);
    expect(countByKey(await fake.messages(), [key]).get(key)).toBe(1);
  });

  it("leaves nothing behind and sends nothing when the transaction rolls back", async () => {
    const pi = await makeUser(["pi"]);
    const doomed = decisionMade({ piUserId: pi.id });
    await expect(
      getDb()
        .transaction()
        .execute(async (trx) => {
          await noticeDecisionMade(trx, doomed);
          throw new Error("the splice failed");
        }),
    ).rejects.toThrow("the splice failed");
    const doomedKey = noticeKey("decision_made", doomed.requestId, pi.id);

    // A notice committed after it is delivered; by then the doomed one would have been too.
    const kept = decisionMade({ piUserId: pi.id });
    await getDb().transaction().execute((trx) => noticeDecisionMade(trx, kept));
    await waitUntilSettled([noticeKey("decision_made", kept.requestId, pi.id)]);

    expect(await getDb().selectFrom("notifications").select("id").where("notice_key", "=", doomedKey).execute()).toEqual([]);
    expect(await getDb().selectFrom("email_deliveries").select("id").where("idempotency_key", "=", doomedKey).execute()).toEqual([]);
    expect(await jobsWithKey(doomedKey)).toBe(0);
    const toPi = (await fake.messages()).filter((m) => m.to.includes(pi.email));
    expect(toPi.map((m) => m.idempotency_key)).toEqual([noticeKey("decision_made", kept.requestId, pi.id)]);
  });

  it("rejects a malformed payload inside the caller's transaction", async () => {
    const pi = await makeUser(["pi"]);
    const bad = { ...decisionMade({ piUserId: pi.id }), reason: "" };
    await expect(getDb().transaction().execute((trx) => noticeDecisionMade(trx, bad))).rejects.toThrow();
    expect(await getDb().selectFrom("notifications").select("id").where("user_id", "=", pi.id).execute()).toEqual([]);
  });

  it("gives up at once on a permanent refusal (409: the key was used for other content) and records why", async () => {
    const pi = await makeUser(["pi"]);
    const payload = decisionMade({ piUserId: pi.id, requestId: randomUUID() });
    const key = noticeKey("decision_made", payload.requestId, pi.id);
    const resend = new Resend(API_KEY, { baseUrl: fake.fake.url });
    await resend.emails.send({ from: "x@nightbreak.test", to: pi.email, subject: "other", text: "other" }, { idempotencyKey: key });

    await getDb().transaction().execute((trx) => noticeDecisionMade(trx, payload));
    const statuses = await waitUntilSettled([key]);
    expect(statuses.get(key)).toEqual({ status: "failed", attempts: 1 });
    const row = await getDb().selectFrom("email_deliveries").select(["last_error", "body_html"]).where("idempotency_key", "=", key).executeTakeFirstOrThrow();
    expect(row.last_error).toMatch(/^409 /);
    expect(row.body_html).toContain("was approved");
  });
});
