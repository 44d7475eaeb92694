// Requests still waiting for a decision when their deadline passes lapse: once, with a
// history row, an audit row and one notice to the PI, however many workers run at once;
// nothing else is touched. The review queue and the PI's list show them as they are.
import { sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import type { RequestState } from "@/db/types";
import { noticeKey } from "@/lib/notices/enqueue";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { LAPSE_NOTE, lapseOverdueRequests } from "@/lib/requests/lapse";
import { listRequestsForPi, lockRequest } from "@/lib/requests/queries";
import { listRecentlyLapsed, listReviewQueue } from "@/lib/review/queue";
import { makeSubmittedRequest, makeWorld } from "../decisions/world";

afterAll(async () => {
  await closeNoticeQueue();
});

const HOUR = 3_600_000;
// The real clock: rows made here with past deadlines are overdue for any later run too, so
// no other file's worker can find one of them "not yet lapsed" and change the story.
const NOW = new Date(Math.floor(Date.now() / 1000) * 1000);
const OVERDUE = { earliestStart: new Date(NOW.getTime() - 72 * HOUR), deadline: new Date(NOW.getTime() - HOUR) };
const AHEAD = { earliestStart: new Date(NOW.getTime() - 72 * HOUR), deadline: new Date(NOW.getTime() + HOUR) };

type World = Awaited<ReturnType<typeof makeWorld>>;

async function requestIn(world: World, state: RequestState, window = OVERDUE, name = `Fixture ${state}`): Promise<string> {
  const id = await makeSubmittedRequest(world, name, { ...window, state: state === "in_review" ? "in_review" : "submitted" });
  if (state !== "submitted" && state !== "in_review") await getDb().updateTable("too_requests").set({ state }).where("id", "=", id).execute();
  return id;
}

async function draftWith(world: World, deadline: Date | null): Promise<string> {
  const row = await getDb()
    .insertInto("too_requests")
    .values({ pi_user_id: world.piId, target_name: "Half-typed draft", deadline, earliest_start: deadline ? new Date(deadline.getTime() - 24 * HOUR) : null })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

async function stateOf(id: string) {
  return (await getDb().selectFrom("too_requests").select(["state", "updated_at"]).where("id", "=", id).executeTakeFirstOrThrow()).state;
}

async function lapseEvents(id: string) {
  return getDb().selectFrom("request_events").select(["from_state", "to_state", "actor_user_id", "note"]).where("request_id", "=", id).where("to_state", "=", "lapsed").execute();
}

async function noticesAbout(id: string) {
  return getDb().selectFrom("notifications").select(["user_id", "event", "notice_key", "title", "body", "link"]).where("notice_key", "like", `%:${id}:%`).execute();
}

async function jobsFor(key: string): Promise<number> {
  const { rows } = await sql<{ n: string }>`select count(*) as n from pgboss.job where data->>'key' = ${key}`.execute(getDb());
  return Number(rows[0]?.n ?? 0);
}

describe("lapsing requests at their deadline", () => {
  it("lapses an overdue submitted or in-review request: state, history by the system, audit, and one notice and e-mail to the PI", async () => {
    const world = await makeWorld([]);
    const submitted = await requestIn(world, "submitted", OVERDUE, "Fading afterglow");
    const inReview = await requestIn(world, "in_review");

    const lapsed = await lapseOverdueRequests(getDb(), NOW);
    expect(lapsed).toEqual(
      expect.arrayContaining([
        { id: submitted, from: "submitted", deadline: OVERDUE.deadline },
        { id: inReview, from: "in_review", deadline: OVERDUE.deadline },
      ]),
    );

    const row = await getDb().selectFrom("too_requests").select(["state", "updated_at"]).where("id", "=", submitted).executeTakeFirstOrThrow();
    expect(row).toEqual({ state: "lapsed", updated_at: NOW });
    expect(await stateOf(inReview)).toBe("lapsed");
    expect(await lapseEvents(submitted)).toEqual([{ from_state: "submitted", to_state: "lapsed", actor_user_id: null, note: LAPSE_NOTE }]);
    expect((await lapseEvents(inReview)).map((e) => e.from_state)).toEqual(["in_review"]);
    const audit = await getDb().selectFrom("audit_log").select(["action", "actor_user_id"]).where("entity_id", "=", submitted).execute();
    expect(audit).toEqual([{ action: "request.lapse", actor_user_id: null }]);

    const key = noticeKey("request_lapsed", submitted, world.piId);
    const notices = await noticesAbout(submitted);
    expect(notices).toHaveLength(1);
    expect(notices[0]).toMatchObject({ user_id: world.piId, event: "request_lapsed", notice_key: key, title: "Your ToO request for Fading afterglow lapsed at its deadline", link: `/requests/${submitted}` });
    expect(notices[0]?.body).toContain("passed while the request was waiting in the review queue, before a director decided it.");
    const email = await getDb().selectFrom("email_deliveries").select(["user_id", "template", "status"]).where("idempotency_key", "=", key).executeTakeFirst();
    expect(email).toEqual({ user_id: world.piId, template: "request_lapsed", status: "queued" });
    expect(await jobsFor(key)).toBe(1);
    expect((await noticesAbout(inReview))[0]?.body).toContain("while the request was in review,");
  });

  it("leaves alone a deadline still ahead or exactly now, decided and withdrawn requests, and drafts", async () => {
    const world = await makeWorld([]);
    const ahead = await requestIn(world, "submitted", AHEAD);
    const exactlyNow = await requestIn(world, "in_review", { earliestStart: OVERDUE.earliestStart, deadline: NOW });
    const settled = await Promise.all((["approved", "declined", "withdrawn", "executed", "not_executed"] as const).map((s) => requestIn(world, s)));
    const drafts = [await draftWith(world, OVERDUE.deadline), await draftWith(world, null)];

    const lapsed = (await lapseOverdueRequests(getDb(), NOW)).map((r) => r.id);
    const mine = [ahead, exactlyNow, ...settled, ...drafts];
    expect(lapsed.filter((id) => mine.includes(id))).toEqual([]);
    expect(await Promise.all(mine.map(stateOf))).toEqual(["submitted", "in_review", "approved", "declined", "withdrawn", "executed", "not_executed", "draft", "draft"]);
    for (const id of mine) {
      expect(await lapseEvents(id)).toEqual([]);
      expect(await noticesAbout(id)).toEqual([]);
    }

    // An hour on, the one that was ahead lapses too.
    const later = await lapseOverdueRequests(getDb(), new Date(NOW.getTime() + 2 * HOUR));
    expect(later.map((r) => r.id)).toEqual(expect.arrayContaining([ahead, exactlyNow]));
  });

  it("is idempotent: a second run lapses nothing and tells nobody again", async () => {
    const world = await makeWorld([]);
    const id = await requestIn(world, "submitted");
    expect((await lapseOverdueRequests(getDb(), NOW)).map((r) => r.id)).toContain(id);
    expect((await lapseOverdueRequests(getDb(), NOW)).map((r) => r.id)).not.toContain(id);
    expect(await lapseEvents(id)).toHaveLength(1);
    expect(await noticesAbout(id)).toHaveLength(1);
    expect(await jobsFor(noticeKey("request_lapsed", id, world.piId))).toBe(1);
  });

  it("lapses each request exactly once when two workers run at the same moment", async () => {
    const world = await makeWorld([]);
    const ids = await Promise.all(Array.from({ length: 12 }, (_, i) => requestIn(world, i % 2 ? "in_review" : "submitted", OVERDUE, `Concurrent ${i}`)));

    const runs = await Promise.all([lapseOverdueRequests(getDb(), NOW), lapseOverdueRequests(getDb(), NOW), lapseOverdueRequests(getDb(), NOW)]);
    const claimed = runs.flat().map((r) => r.id).filter((id) => ids.includes(id));
    expect([...claimed].sort()).toEqual([...ids].sort());
    for (const id of ids) {
      expect(await stateOf(id)).toBe("lapsed");
      expect(await lapseEvents(id)).toHaveLength(1);
      expect(await noticesAbout(id)).toHaveLength(1);
      expect(await jobsFor(noticeKey("request_lapsed", id, world.piId))).toBe(1);
    }
  });

  it("skips a request another transaction holds (a withdrawal in progress) without waiting, and lapses it on the next run", async () => {
    const world = await makeWorld([]);
    const id = await requestIn(world, "submitted");
    let locked!: () => void;
    let release!: () => void;
    const isLocked = new Promise<void>((resolve) => (locked = resolve));
    const released = new Promise<void>((resolve) => (release = resolve));
    const holder = getDb()
      .transaction()
      .execute(async (trx) => {
        await lockRequest(trx, id);
        locked();
        await released;
      });
    await isLocked;
    const first = await lapseOverdueRequests(getDb(), NOW);
    expect(first.map((r) => r.id)).not.toContain(id);
    release();
    await holder;
    expect(await stateOf(id)).toBe("submitted");
    expect((await lapseOverdueRequests(getDb(), NOW)).map((r) => r.id)).toContain(id);
    expect(await stateOf(id)).toBe("lapsed");
  });

  it("keeps an overdue request out of the review queue even before it lapses, lists it as lapsed after, and the PI's list shows it lapsed", async () => {
    const world = await makeWorld([]);
    const overdue = await requestIn(world, "submitted", OVERDUE, "Overdue target");
    const waiting = await requestIn(world, "submitted", AHEAD, "Waiting target");

    const queue = (await listReviewQueue(getDb(), NOW)).map((q) => q.id);
    expect(queue).toContain(waiting);
    expect(queue).not.toContain(overdue);

    await lapseOverdueRequests(getDb(), NOW);
    const recent = await listRecentlyLapsed(getDb(), NOW);
    expect(recent.find((r) => r.id === overdue)).toMatchObject({ targetName: "Overdue target", deadline: OVERDUE.deadline, urgency: "within_days" });
    expect(recent.map((r) => r.id)).not.toContain(waiting);
    // A week on it has left the lapsed list as well.
    expect((await listRecentlyLapsed(getDb(), new Date(NOW.getTime() + 8 * 24 * HOUR))).map((r) => r.id)).not.toContain(overdue);

    const mine = await listRequestsForPi(getDb(), world.piId);
    expect(mine.find((r) => r.id === overdue)).toMatchObject({ state: "lapsed", updatedAt: NOW });
    expect(mine.find((r) => r.id === waiting)).toMatchObject({ state: "submitted" });
  });
});
