// A burst of 200 notices while the mail service fails 30 % of requests, after storing the
// message (so the sender never hears that it arrived): every e-mail still arrives once.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { noticeKey } from "@/lib/notices/enqueue";
import { noticeBlockDisplaced } from "@/lib/notices/notify";
import { closeNoticeQueue } from "@/lib/notices/queue";
import type { NoticeWorker } from "@/lib/notices/worker";
import { blockDisplaced } from "../../support/notice-payloads";
import { clearNoticeBacklog, countByKey, makeUsers, SETTLE_TIMEOUT_MS, startTestFake, startTestWorker, waitUntilSettled, type TestFake } from "./helpers";

let fake: TestFake;
let worker: NoticeWorker;

beforeAll(async () => {
  await clearNoticeBacklog();
  fake = await startTestFake({ failRate: 0.3, failStatus: 500, failMode: "after-store" });
  worker = await startTestWorker(fake.fake);
});

afterAll(async () => {
  await worker.stop();
  await closeNoticeQueue();
  await fake.close();
});

describe("a burst of notices against a failing mail service", () => {
  it("delivers each of 200 e-mails exactly once", async () => {
    const observers = await makeUsers(40, ["observer"]);
    const payloads = observers.flatMap((o) => Array.from({ length: 5 }, () => blockDisplaced({ observerUserId: o.id })));
    // Twenty "splices" at once, ten displacements each.
    await Promise.all(
      Array.from({ length: 20 }, (_, i) =>
        getDb()
          .transaction()
          .execute(async (trx) => {
            for (const p of payloads.slice(i * 10, i * 10 + 10)) await noticeBlockDisplaced(trx, p);
          }),
      ),
    );
    const keys = payloads.map((p) => noticeKey("block_displaced", p.displacementId, p.observerUserId));
    expect(new Set(keys).size).toBe(200);

    const statuses = await waitUntilSettled(keys, 2 * SETTLE_TIMEOUT_MS);
    expect([...statuses.values()].filter((s) => s.status !== "sent")).toEqual([]);

    const counts = countByKey(await fake.messages(), keys);
    expect(counts.size).toBe(200);
    expect([...counts.values()].every((n) => n === 1)).toBe(true);

    // The faults really happened, and retries covered them.
    const stats = await fake.stats();
    expect(stats.injectedFailures).toBeGreaterThan(20);
    expect(stats.idempotentReplays).toBeGreaterThan(0);
    const attempts = [...statuses.values()].reduce((sum, s) => sum + s.attempts, 0);
    expect(attempts).toBeGreaterThan(200);
  }, 3 * SETTLE_TIMEOUT_MS);
});
