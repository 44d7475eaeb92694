// The minute job's wiring: starting it registers the every-minute schedule on its queue,
// and a job on that queue lapses what is overdue. (The cron itself is pg-boss's; waiting
// a minute for it would only test pg-boss.)
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { closeNoticeQueue, getNoticeQueue } from "@/lib/notices/queue";
import { LAPSE_CRON, LAPSE_QUEUE, startLapseJob, type LapseJob } from "@/lib/requests/lapse-job";
import { makeSubmittedRequest, makeWorld } from "../decisions/world";

let job: LapseJob | undefined;

afterAll(async () => {
  await job?.stop();
  await closeNoticeQueue();
});

const HOUR = 3_600_000;

async function stateOf(id: string) {
  return (await getDb().selectFrom("too_requests").select("state").where("id", "=", id).executeTakeFirstOrThrow()).state;
}

describe("the lapse job", () => {
  it("schedules itself every minute and lapses overdue requests when its job runs", async () => {
    const world = await makeWorld([]);
    const now = Date.now();
    const id = await makeSubmittedRequest(world, "Overdue for the job", { earliestStart: new Date(now - 48 * HOUR), deadline: new Date(now - HOUR) });

    job = await startLapseJob();
    const { rows } = await sql<{ name: string; cron: string; timezone: string }>`select name, cron, timezone from pgboss.schedule where name = ${LAPSE_QUEUE}`.execute(getDb());
    expect(rows).toEqual([{ name: LAPSE_QUEUE, cron: LAPSE_CRON, timezone: "UTC" }]);

    // Whether or not the cron has fired yet, one more job is enough (the queue keeps at most one waiting).
    await (await getNoticeQueue()).send(LAPSE_QUEUE, {});
    const until = Date.now() + 30_000;
    while ((await stateOf(id)) !== "lapsed" && Date.now() < until) await new Promise((r) => setTimeout(r, 250));
    expect(await stateOf(id)).toBe("lapsed");
  }, 45_000);
});
