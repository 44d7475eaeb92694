// Killing the worker process mid-burst (SIGKILL: no goodbye) and starting another loses
// nothing and duplicates nothing, while the mail service also rate-limits 30 % of sends.
import { spawn, type ChildProcess } from "node:child_process";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { noticeKey } from "@/lib/notices/enqueue";
import { noticePaybackScheduled } from "@/lib/notices/notify";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { paybackScheduled } from "../../support/notice-payloads";
import { API_KEY, APP_URL, clearNoticeBacklog, countByKey, deliveryStatuses, makeUsers, policyEnv, SETTLE_TIMEOUT_MS, startTestFake, TEST_POLICY, waitFor, waitUntilSettled, type TestFake } from "./helpers";

// Starting a worker (node, tsx, React, pg-boss) takes a second or two, far longer under load.
const START_TIMEOUT_MS = 60_000;

let fake: TestFake;
const children: ChildProcess[] = [];

beforeAll(async () => {
  await clearNoticeBacklog();
  fake = await startTestFake({ failRate: 0.3, failStatus: 429, failMode: "before-store" });
});

afterAll(async () => {
  for (const child of children) if (child.exitCode === null && child.signalCode === null) child.kill("SIGKILL");
  await closeNoticeQueue();
  await fake.close();
});

/** scripts/worker.ts in a process of its own (node with tsx as a loader: no wrapper process to kill instead). */
function spawnWorker(): { child: ChildProcess; output: () => string; ready: Promise<void> } {
  const child = spawn(process.execPath, ["--import", "tsx", "scripts/worker.ts"], {
    cwd: process.cwd(),
    // NODE_ENV=production: React's production build, as the worker runs in the app.
    env: { ...process.env, ...policyEnv(TEST_POLICY), NODE_ENV: "production", RESEND_API_KEY: API_KEY, RESEND_BASE_URL: fake.fake.url, APP_URL },
    stdio: ["ignore", "pipe", "pipe"],
  });
  children.push(child);
  let output = "";
  const ready = new Promise<void>((resolve, reject) => {
    child.stdout?.on("data", (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes("notice worker ready")) resolve();
    });
    child.stderr?.on("data", (chunk: Buffer) => (output += chunk.toString()));
    child.once("exit", (code, signal) => reject(new Error(`worker exited (${code ?? signal}) before it was ready:\n${output}`)));
    setTimeout(() => reject(new Error(`worker not ready after ${START_TIMEOUT_MS / 1000} s:\n${output}`)), START_TIMEOUT_MS).unref();
  });
  return { child, output: () => output, ready };
}

function exited(child: ChildProcess): Promise<void> {
  return child.exitCode !== null || child.signalCode !== null ? Promise.resolve() : new Promise((resolve) => child.once("exit", () => resolve()));
}

describe("a worker killed mid-burst", () => {
  it("loses nothing: the next worker delivers every e-mail exactly once", async () => {
    const observers = await makeUsers(30, ["observer"]);
    const payloads = observers.flatMap((o) => Array.from({ length: 4 }, () => paybackScheduled({ observerUserId: o.id })));
    await getDb()
      .transaction()
      .execute(async (trx) => {
        for (const p of payloads) await noticePaybackScheduled(trx, p);
      });
    const keys = payloads.map((p) => noticeKey("payback_scheduled", p.paybackBlockId, p.observerUserId));

    const first = spawnWorker();
    await first.ready;
    let sentAtKill = 0;
    await waitFor(
      "the first worker to send 10 e-mails",
      async () => {
        if (first.child.exitCode !== null || first.child.signalCode !== null) throw new Error(`the first worker ended early:\n${first.output()}`);
        sentAtKill = [...(await deliveryStatuses(keys)).values()].filter((s) => s.status === "sent").length;
        return sentAtKill >= 10;
      },
      SETTLE_TIMEOUT_MS,
      25,
    );
    first.child.kill("SIGKILL");
    await exited(first.child);
    expect(first.child.signalCode).toBe("SIGKILL");
    expect(sentAtKill).toBeLessThan(keys.length);

    const second = spawnWorker();
    await second.ready;
    // Waits on the real condition; the bound is only there to fail with the stuck e-mails' story.
    const statuses = await waitUntilSettled(keys, 2 * SETTLE_TIMEOUT_MS);
    second.child.kill("SIGTERM");
    await exited(second.child);

    expect([...statuses.values()].filter((s) => s.status !== "sent")).toEqual([]);
    const counts = countByKey(await fake.messages(), keys);
    expect(counts.size).toBe(keys.length);
    expect([...counts.values()].filter((n) => n !== 1)).toEqual([]);
    expect((await fake.stats()).injectedFailures).toBeGreaterThan(0);
    expect(second.child.exitCode).toBe(0);
  }, 2 * START_TIMEOUT_MS + 3 * SETTLE_TIMEOUT_MS + 30_000);
});
