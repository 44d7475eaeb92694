import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { declineRequest, returnRequest } from "@/lib/decisions/decline";
import { DeadlinePassedError, DecisionError, SlotTakenError } from "@/lib/decisions/errors";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { at, makeSubmittedRequest, makeWorld } from "./world";

afterAll(async () => {
  await closeNoticeQueue();
});

async function blocksOf(telescopeId: string) {
  return getDb().selectFrom("blocks").select(["kind", "starts_at", "ends_at", "too_request_id"]).where("telescope_id", "=", telescopeId).orderBy("starts_at").execute();
}

describe("approving a request splices the schedule in one transaction", () => {
  it("splits the block the slot lies in, books the ledger, records everything and queues the notices", async () => {
    const world = await makeWorld([["2027-02-01T00:00:00Z", "2027-02-01T04:00:00Z"], ["2027-02-01T04:00:00Z", "2027-02-01T08:00:00Z"]]);
    const requestId = await makeSubmittedRequest(world);
    const result = await approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-02-01T01:00:00Z"), end: at("2027-02-01T02:30:00Z"), note: "Go" });
    expect(result.displacedMinutes).toBe(90);

    const blocks = await blocksOf(world.telescopeId);
    expect(blocks.map((b) => [b.kind, b.starts_at.toISOString().slice(11, 16), b.ends_at.toISOString().slice(11, 16)])).toEqual([
      ["science", "00:00", "01:00"],
      ["too", "01:00", "02:30"],
      ["science", "02:30", "04:00"],
      ["science", "04:00", "08:00"],
    ]);
    const db = getDb();
    const request = await db.selectFrom("too_requests").select(["state"]).where("id", "=", requestId).executeTakeFirstOrThrow();
    expect(request.state).toBe("approved");
    const ledger = await db.selectFrom("ledger_entries").select(["kind", "minutes", "program_id"]).where("request_id", "=", requestId).orderBy("kind").execute();
    expect(ledger.map((l) => [l.kind, l.minutes])).toEqual([["charge", 90], ["credit", 90]]);
    expect(ledger.find((l) => l.kind === "credit")?.program_id).toBe(world.programId);
    const displacements = await db.selectFrom("displacements").select(["minutes", "change", "observer_user_id"]).where("request_id", "=", requestId).execute();
    expect(displacements).toEqual([{ minutes: 90, change: "split", observer_user_id: world.observer.id }]);
    const changes = await db.selectFrom("schedule_changes").select("kind").where("request_id", "=", requestId).orderBy("id").execute();
    expect(changes.map((c) => c.kind)).toEqual(["override", "displaced"]);
    const notices = await db.selectFrom("notifications").select(["user_id", "event"]).where("notice_key", "like", `%${requestId}%`).execute();
    expect(notices).toContainEqual({ user_id: world.piId, event: "decision_made" });
    const displacedNotice = await db.selectFrom("notifications").select("event").where("user_id", "=", world.observer.id).where("event", "=", "block_displaced").execute();
    expect(displacedNotice).toHaveLength(1);
    const audit = await db.selectFrom("audit_log").select("action").where("entity_id", "=", requestId).execute();
    expect(audit.map((a) => a.action)).toContain("request.approve");
  });

  it("handles a slot across two blocks, one covering a block entirely, touching edges and midnight UT", async () => {
    const world = await makeWorld([
      ["2027-02-02T22:00:00Z", "2027-02-02T23:00:00Z"],
      ["2027-02-02T23:00:00Z", "2027-02-03T00:00:00Z"],
      ["2027-02-03T00:00:00Z", "2027-02-03T02:00:00Z"],
    ]);
    const requestId = await makeSubmittedRequest(world);
    const result = await approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-02-02T23:00:00Z"), end: at("2027-02-03T00:30:00Z") });
    expect(result.displacedMinutes).toBe(90);
    const blocks = await blocksOf(world.telescopeId);
    expect(blocks.map((b) => [b.kind, b.starts_at.toISOString().slice(11, 16), b.ends_at.toISOString().slice(11, 16)])).toEqual([
      ["science", "22:00", "23:00"], // touching: untouched
      ["too", "23:00", "00:30"],
      ["science", "00:30", "02:00"],
    ]);
  });

  it("is harmless when repeated, and refuses another slot for an approved request", async () => {
    const world = await makeWorld([["2027-02-04T00:00:00Z", "2027-02-04T04:00:00Z"]]);
    const requestId = await makeSubmittedRequest(world);
    const slot = { requestId, telescopeId: world.telescopeId, start: at("2027-02-04T01:00:00Z"), end: at("2027-02-04T02:00:00Z") };
    await approveRequest(getDb(), world.director, slot);
    const again = await approveRequest(getDb(), world.director, slot);
    expect(again.alreadyApproved).toBe(true);
    expect(await blocksOf(world.telescopeId)).toHaveLength(3);
    await expect(approveRequest(getDb(), world.director, { ...slot, start: at("2027-02-04T02:00:00Z"), end: at("2027-02-04T03:00:00Z") })).rejects.toBeInstanceOf(DecisionError);
    const ledger = await getDb().selectFrom("ledger_entries").select("kind").where("request_id", "=", requestId).execute();
    expect(ledger).toHaveLength(2);
  });

  it("lets exactly one of two simultaneous overlapping approvals through; the other gets a clear conflict", async () => {
    const world = await makeWorld([["2027-02-05T00:00:00Z", "2027-02-05T04:00:00Z"], ["2027-02-05T04:00:00Z", "2027-02-05T08:00:00Z"]]);
    const first = await makeSubmittedRequest(world, "Object A");
    const second = await makeSubmittedRequest(world, "Object B");
    const outcomes = await Promise.allSettled([
      approveRequest(getDb(), world.director, { requestId: first, telescopeId: world.telescopeId, start: at("2027-02-05T03:00:00Z"), end: at("2027-02-05T05:00:00Z") }),
      approveRequest(getDb(), world.director, { requestId: second, telescopeId: world.telescopeId, start: at("2027-02-05T04:30:00Z"), end: at("2027-02-05T06:00:00Z") }),
    ]);
    expect(outcomes.filter((o) => o.status === "fulfilled")).toHaveLength(1);
    const rejected = outcomes.find((o) => o.status === "rejected") as PromiseRejectedResult;
    expect(rejected.reason).toBeInstanceOf(SlotTakenError);
    expect(String(rejected.reason.message)).toMatch(/Nothing was changed/);
    const blocks = await blocksOf(world.telescopeId);
    expect(blocks.filter((b) => b.kind === "too")).toHaveLength(1);
    for (let i = 1; i < blocks.length; i++) expect(blocks[i]!.starts_at.getTime()).toBeGreaterThanOrEqual(blocks[i - 1]!.ends_at.getTime());
    const states = await getDb().selectFrom("too_requests").select("state").where("id", "in", [first, second]).execute();
    expect(states.map((s) => s.state).sort()).toEqual(["approved", "submitted"]);
  });

  it("lets two simultaneous approvals of separate slots in the same block both through", async () => {
    const world = await makeWorld([["2027-02-07T00:00:00Z", "2027-02-07T08:00:00Z"]]);
    const first = await makeSubmittedRequest(world, "Object C");
    const second = await makeSubmittedRequest(world, "Object D");
    const outcomes = await Promise.allSettled([
      approveRequest(getDb(), world.director, { requestId: first, telescopeId: world.telescopeId, start: at("2027-02-07T01:00:00Z"), end: at("2027-02-07T02:00:00Z") }),
      approveRequest(getDb(), world.director, { requestId: second, telescopeId: world.telescopeId, start: at("2027-02-07T05:00:00Z"), end: at("2027-02-07T06:00:00Z") }),
    ]);
    expect(outcomes.map((o) => o.status)).toEqual(["fulfilled", "fulfilled"]);
    const blocks = await blocksOf(world.telescopeId);
    expect(blocks.map((b) => [b.kind, b.starts_at.toISOString().slice(11, 16), b.ends_at.toISOString().slice(11, 16)])).toEqual([
      ["science", "00:00", "01:00"],
      ["too", "01:00", "02:00"],
      ["science", "02:00", "05:00"],
      ["too", "05:00", "06:00"],
      ["science", "06:00", "08:00"],
    ]);
  });

  it("refuses to approve a request whose deadline has passed, changes nothing in the schedule or the ledger, and lapses it", async () => {
    const world = await makeWorld([["2027-02-08T00:00:00Z", "2027-02-08T04:00:00Z"]]);
    const hour = 3_600_000;
    const deadline = new Date(Math.floor(Date.now() / 60_000) * 60_000 - hour);
    const requestId = await makeSubmittedRequest(world, "Faded transient", { earliestStart: new Date(deadline.getTime() - 48 * hour), deadline, state: "in_review" });
    const slot = { requestId, telescopeId: world.telescopeId, start: at("2027-02-08T01:00:00Z"), end: at("2027-02-08T02:00:00Z") };

    const refusal = await approveRequest(getDb(), world.director, slot).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(DeadlinePassedError);
    expect((refusal as DeadlinePassedError).status).toBe(409);
    expect((refusal as Error).message).toBe(
      `The PI's deadline (${deadline.toISOString().slice(0, 16).replace("T", " ")} UT) has passed, so this request has lapsed and can no longer be approved. Nothing was changed.`,
    );
    const db = getDb();
    expect((await blocksOf(world.telescopeId)).map((b) => b.kind)).toEqual(["science"]);
    expect(await db.selectFrom("ledger_entries").select("id").where("request_id", "=", requestId).execute()).toEqual([]);
    expect(await db.selectFrom("request_decisions").select("id").where("request_id", "=", requestId).execute()).toEqual([]);
    expect(await db.selectFrom("schedule_changes").select("id").where("request_id", "=", requestId).execute()).toEqual([]);
    // Lapsed at once rather than at the minute job's next run; the PI hears it lapsed, not that it was decided.
    expect((await db.selectFrom("too_requests").select("state").where("id", "=", requestId).executeTakeFirstOrThrow()).state).toBe("lapsed");
    const events = await db.selectFrom("request_events").select(["from_state", "to_state", "actor_user_id"]).where("request_id", "=", requestId).execute();
    expect(events).toEqual([{ from_state: "in_review", to_state: "lapsed", actor_user_id: null }]);
    const notices = await db.selectFrom("notifications").select(["user_id", "event"]).where("notice_key", "like", `%${requestId}%`).execute();
    expect(notices).toEqual([{ user_id: world.piId, event: "request_lapsed" }]);

    // Once lapsed, the same answer.
    await expect(approveRequest(getDb(), world.director, slot)).rejects.toThrow(/has passed, so this request has lapsed and can no longer be approved/);
  });

  it("declines with a required reason, and returns a request to the PI as a draft with the note", async () => {
    const world = await makeWorld([]);
    const a = await makeSubmittedRequest(world);
    await expect(declineRequest(getDb(), world.director, { requestId: a, reason: "  " })).rejects.toThrow("reason");
    await declineRequest(getDb(), world.director, { requestId: a, reason: "Too close to the Sun for this telescope." });
    const b = await makeSubmittedRequest(world);
    await returnRequest(getDb(), world.director, { requestId: b, note: "Please add a finding chart." });
    const rows = await getDb().selectFrom("too_requests").select(["id", "state", "director_note"]).where("id", "in", [a, b]).execute();
    expect(rows.find((r) => r.id === a)).toMatchObject({ state: "declined", director_note: "Too close to the Sun for this telescope." });
    expect(rows.find((r) => r.id === b)).toMatchObject({ state: "draft", director_note: "Please add a finding chart." });
    await expect(approveRequest(getDb(), world.director, { requestId: a, telescopeId: world.telescopeId, start: at("2027-02-06T01:00:00Z"), end: at("2027-02-06T02:00:00Z") })).rejects.toThrow(/declined/);
  });
});
