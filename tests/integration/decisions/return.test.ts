// Returning a request to the PI reaches the PI: in the same transaction as the state
// change, one in-app notice and one queued e-mail, carrying the director's note and a
// link to edit the request. A request returned again after it was refiled is told again.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import type { NoticeEvent } from "@/db/types";
import { declineRequest, returnRequest } from "@/lib/decisions/decline";
import { DecisionError } from "@/lib/decisions/errors";
import { noticeKey } from "@/lib/notices/enqueue";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { makeSubmittedRequest, makeWorld } from "./world";

afterAll(async () => {
  await closeNoticeQueue();
});

async function noticesFor(userId: string, event: NoticeEvent) {
  return getDb().selectFrom("notifications").select(["user_id", "event", "notice_key", "title", "body", "link"]).where("user_id", "=", userId).where("event", "=", event).orderBy("created_at").execute();
}

async function returnDecisions(requestId: string) {
  return getDb().selectFrom("request_decisions").select(["id"]).where("request_id", "=", requestId).where("decision", "=", "return").orderBy("decided_at").execute();
}

async function jobsFor(key: string) {
  const { rows } = await sql<{ payload: { note: string; requestId: string } }>`select data->'payload' as payload from pgboss.job where data->>'key' = ${key}`.execute(getDb());
  return rows;
}

describe("returning a request to the PI", () => {
  it("turns it back into a draft and tells the PI once, in-app and by e-mail, with the note and a link to edit it", async () => {
    const world = await makeWorld([]);
    const requestId = await makeSubmittedRequest(world, "Returned comet");
    const note = "Please attach a finding chart.\nAnd ask for 90 minutes, not 60.";
    await returnRequest(getDb(), world.director, { requestId, note: `  ${note}  ` });

    const db = getDb();
    expect(await db.selectFrom("too_requests").select(["state", "director_note"]).where("id", "=", requestId).executeTakeFirstOrThrow()).toEqual({ state: "draft", director_note: note });
    const [decision] = await returnDecisions(requestId);
    const key = noticeKey("request_returned", decision!.id, world.piId);

    const notices = await noticesFor(world.piId, "request_returned");
    expect(notices).toHaveLength(1);
    expect(notices[0]).toMatchObject({ notice_key: key, title: "Your ToO request for Returned comet was returned for changes", link: `/requests/${requestId}` });
    expect(notices[0]?.body).toContain(note);
    expect(notices[0]?.body).toContain("Your deadline 2099-01-01 00:00 UT");

    const email = await db.selectFrom("email_deliveries").select(["user_id", "template", "status"]).where("idempotency_key", "=", key).execute();
    expect(email).toEqual([{ user_id: world.piId, template: "request_returned", status: "queued" }]);
    const jobs = await jobsFor(key);
    expect(jobs).toHaveLength(1);
    expect(jobs[0]?.payload).toMatchObject({ requestId, note });

    // Nobody else hears of it.
    const others = await db.selectFrom("notifications").select("user_id").where("event", "=", "request_returned").where("link", "=", `/requests/${requestId}`).execute();
    expect(others).toEqual([{ user_id: world.piId }]);
  });

  it("tells the PI again when the refiled request is returned a second time", async () => {
    const world = await makeWorld([]);
    const requestId = await makeSubmittedRequest(world, "Twice returned");
    await returnRequest(getDb(), world.director, { requestId, note: "Add a finding chart." });
    // The PI files it again (the filing itself is tested with the request service).
    await getDb().updateTable("too_requests").set({ state: "submitted", submitted_at: new Date() }).where("id", "=", requestId).execute();
    await returnRequest(getDb(), world.director, { requestId, note: "The chart is for the wrong night." });

    const decisions = await returnDecisions(requestId);
    expect(decisions).toHaveLength(2);
    const notices = await noticesFor(world.piId, "request_returned");
    expect(notices.map((n) => n.notice_key)).toEqual(decisions.map((d) => noticeKey("request_returned", d.id, world.piId)));
    expect(notices[1]?.body).toContain("The chart is for the wrong night.");
    const deliveries = await getDb().selectFrom("email_deliveries").select("template").where("user_id", "=", world.piId).where("template", "=", "request_returned").execute();
    expect(deliveries).toHaveLength(2);
  });

  it("tells nobody when the return is refused", async () => {
    const world = await makeWorld([]);
    const requestId = await makeSubmittedRequest(world);
    await expect(returnRequest(getDb(), world.director, { requestId, note: "   " })).rejects.toBeInstanceOf(DecisionError);
    await declineRequest(getDb(), world.director, { requestId, reason: "Below our limits." });
    await expect(returnRequest(getDb(), world.director, { requestId, note: "Change the slot." })).rejects.toThrow(/declined: it cannot be returned/);
    expect(await noticesFor(world.piId, "request_returned")).toEqual([]);
    expect(await returnDecisions(requestId)).toEqual([]);
  });

  it("an e-mail the PI turned off is not queued, but the in-app notice is still written", async () => {
    const world = await makeWorld([]);
    await getDb().insertInto("notification_preferences").values({ user_id: world.piId, event: "request_returned", email: false }).execute();
    const requestId = await makeSubmittedRequest(world);
    await returnRequest(getDb(), world.director, { requestId, note: "Lower the airmass limit." });
    expect(await noticesFor(world.piId, "request_returned")).toHaveLength(1);
    expect(await getDb().selectFrom("email_deliveries").select("id").where("user_id", "=", world.piId).execute()).toEqual([]);
  });
});
