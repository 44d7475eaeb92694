import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { findOwedMinutes } from "@/lib/ledger/queries";
import { listOwedToObserver } from "@/lib/ledger/owed";
import { PaybackRefusedError, schedulePayback } from "@/lib/ledger/payback";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { BlockConflictError } from "@/lib/schedule/service";
import { at, makeSubmittedRequest, makeWorld } from "../decisions/world";

afterAll(async () => {
  await closeNoticeQueue();
});

async function owedWorld(day: string) {
  const world = await makeWorld([[`${day}T00:00:00Z`, `${day}T04:00:00Z`]]);
  const requestId = await makeSubmittedRequest(world);
  await approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at(`${day}T01:00:00Z`), end: at(`${day}T03:00:00Z`) });
  const program = await getDb().selectFrom("programs").select("semester_id").where("id", "=", world.programId).executeTakeFirstOrThrow();
  return { ...world, semesterId: program.semester_id };
}

describe("payback blocks", () => {
  it("creates a payback block, books the repayment, logs the change, tells the observer — and the balance falls", async () => {
    const world = await owedWorld("2027-04-01");
    const db = getDb();
    expect(await findOwedMinutes(db, world.programId, world.semesterId)).toBe(120);
    const result = await schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-04-05T01:00:00Z"), endsAt: at("2027-04-05T02:30:00Z"), note: "" });
    expect(result).toMatchObject({ minutes: 90, owedBeforeMinutes: 120, owedAfterMinutes: 30, observerUserId: world.observer.id });
    expect(await findOwedMinutes(db, world.programId, world.semesterId)).toBe(30);

    const block = await db.selectFrom("blocks").selectAll().where("id", "=", result.blockId).executeTakeFirstOrThrow();
    expect(block).toMatchObject({ kind: "payback", program_id: world.programId, observer_user_id: world.observer.id });
    const repay = await db.selectFrom("ledger_entries").selectAll().where("block_id", "=", result.blockId).executeTakeFirstOrThrow();
    expect(repay).toMatchObject({ kind: "repay", minutes: 90, program_id: world.programId });
    const change = await db.selectFrom("schedule_changes").select(["kind", "summary"]).where("block_id", "=", result.blockId).executeTakeFirstOrThrow();
    expect(change.kind).toBe("payback");
    const notice = await db.selectFrom("notifications").select(["event", "title"]).where("user_id", "=", world.observer.id).where("event", "=", "payback_scheduled").executeTakeFirstOrThrow();
    expect(notice.title).toMatch(/^Payback block for PRG\w+: 1 h 30 min on T\w+$/);
    const audit = await db.selectFrom("audit_log").select("action").where("entity_id", "=", result.blockId).execute();
    expect(audit.map((a) => a.action)).toEqual(["ledger.payback"]);

    // The observer's home page line.
    const owed = await listOwedToObserver(db, world.observer.id, at("2027-04-01T00:00:00Z"));
    expect(owed).toEqual([expect.objectContaining({ programId: world.programId, yourDisplacedMinutes: 120, creditedMinutes: 120, repaidMinutes: 90, owedMinutes: 30, nextPayback: expect.objectContaining({ startsAt: at("2027-04-05T01:00:00Z") }) })]);
  });

  it("refuses to repay more than is owed, or anything when nothing is owed; nothing is saved", async () => {
    const world = await owedWorld("2027-04-10");
    const db = getDb();
    const tooMuch = schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-04-12T01:00:00Z"), endsAt: at("2027-04-12T03:01:00Z"), note: "" });
    await expect(tooMuch).rejects.toBeInstanceOf(PaybackRefusedError);
    await expect(tooMuch).rejects.toThrow(/^PRG\w+ is owed 2 h 00 min; a payback block of 2 h 01 min would repay more than that\. Shorten it to at most 2 h 00 min\. Nothing was saved\.$/);
    await schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-04-12T01:00:00Z"), endsAt: at("2027-04-12T03:00:00Z"), note: "" });
    await expect(
      schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-04-13T01:00:00Z"), endsAt: at("2027-04-13T01:15:00Z"), note: "" }),
    ).rejects.toThrow(/is owed nothing on the ledger/);
    const paybacks = await db.selectFrom("blocks").select("id").where("program_id", "=", world.programId).where("kind", "=", "payback").execute();
    expect(paybacks).toHaveLength(1);
  });

  it("refuses an overlapping payback block with a message naming the block in the way", async () => {
    const world = await owedWorld("2027-04-20");
    const attempt = schedulePayback(getDb(), world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-04-20T03:30:00Z"), endsAt: at("2027-04-20T04:30:00Z"), note: "" });
    await expect(attempt).rejects.toBeInstanceOf(BlockConflictError);
    await expect(attempt).rejects.toThrow(/^That time overlaps PRG\w+ on Scope \w+, 2027-04-20 03:00–04:00 UT\. Nothing was saved\.$/);
    expect(await findOwedMinutes(getDb(), world.programId, world.semesterId)).toBe(120);
  });

  it("books concurrent paybacks one after the other: together they never repay more than is owed", async () => {
    const world = await owedWorld("2027-04-25");
    const db = getDb();
    const attempts = await Promise.allSettled(
      [0, 1, 2].map((i) =>
        schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at(`2027-04-2${6 + i}T01:00:00Z`), endsAt: at(`2027-04-2${6 + i}T02:00:00Z`), note: "" }),
      ),
    );
    expect(attempts.filter((a) => a.status === "fulfilled")).toHaveLength(2);
    expect(await findOwedMinutes(db, world.programId, world.semesterId)).toBe(0);
  });
});
