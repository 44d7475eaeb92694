import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { findOwedMinutes } from "@/lib/ledger/queries";
import { listOwedToObserver } from "@/lib/ledger/owed";
import { schedulePaybackAction } from "@/app/(desk)/ledger/actions";
import { PaybackOutsideNightError, PaybackRefusedError, schedulePayback } from "@/lib/ledger/payback";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { BlockConflictError } from "@/lib/schedule/service";
import { at, makeSubmittedRequest, makeWorld } from "../decisions/world";
import { sessionToken, withSessionCookie } from "../request-scope";

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

/** Everything a payback writes, for one program: none of it may appear when one is refused. */
async function paybackTraces(programId: string, telescopeId: string) {
  const db = getDb();
  const [blocks, repays, changes] = await Promise.all([
    db.selectFrom("blocks").select("id").where("program_id", "=", programId).where("kind", "=", "payback").execute(),
    db.selectFrom("ledger_entries").select("id").where("program_id", "=", programId).where("kind", "=", "repay").execute(),
    db.selectFrom("schedule_changes").select("id").where("telescope_id", "=", telescopeId).where("kind", "=", "payback").execute(),
  ]);
  return { blocks: blocks.length, repays: repays.length, changes: changes.length };
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
  // The fixture site: 30° S, 70° W, America/Santiago (GMT-3 in January).
  it("refuses a block in daylight, naming that night's sunset and sunrise in UT and local time; nothing is saved", async () => {
    const world = await owedWorld("2027-01-10");
    const db = getDb();
    const site = (await db.selectFrom("sites").select("name").where("id", "=", world.siteId).executeTakeFirstOrThrow()).name;
    const message = `That time is in daylight at ${site}. On the night of 2027-01-14 the Sun is down from sunset at 2027-01-14 23:46 UT (20:46 GMT-3) to sunrise at 2027-01-15 09:53 UT (06:53 GMT-3): a payback block must lie wholly within that time. Nothing was saved.`;
    // Midday at the site: 12:00–13:00 local.
    const midday = schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-01-15T15:00:00Z"), endsAt: at("2027-01-15T16:00:00Z"), note: "" });
    await expect(midday).rejects.toBeInstanceOf(PaybackOutsideNightError);
    await expect(midday).rejects.toMatchObject({ message, fields: ["startsAt", "endsAt"] });
    expect(await paybackTraces(world.programId, world.telescopeId)).toEqual({ blocks: 0, repays: 0, changes: 0 });
    expect(await findOwedMinutes(db, world.programId, world.semesterId)).toBe(120);
    const notices = await db.selectFrom("notifications").select("id").where("user_id", "=", world.observer.id).where("event", "=", "payback_scheduled").execute();
    expect(notices).toEqual([]);

    // The ledger page's form shows it beside the start and the end.
    const session = await sessionToken(world.director, ["director"]);
    const answer = await withSessionCookie("/ledger", session, () =>
      schedulePaybackAction({ programId: world.programId, telescopeId: world.telescopeId, startsAt: "2027-01-15T15:00", endsAt: "2027-01-15T16:00", note: "" }),
    );
    expect(answer).toEqual({ ok: false, message, fieldErrors: { startsAt: message, endsAt: message } });
    expect(await paybackTraces(world.programId, world.telescopeId)).toEqual({ blocks: 0, repays: 0, changes: 0 });

    // The same program, the same telescope, after dark that evening: booked.
    const night = await schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at("2027-01-16T02:00:00Z"), endsAt: at("2027-01-16T03:00:00Z"), note: "" });
    expect(night.minutes).toBe(60);
    expect(await paybackTraces(world.programId, world.telescopeId)).toEqual({ blocks: 1, repays: 1, changes: 1 });
    expect(await findOwedMinutes(db, world.programId, world.semesterId)).toBe(60);
  });

  it("refuses a block that runs past sunrise (beside the end) or starts before sunset (beside the start), and takes one from sunset to sunrise exactly", async () => {
    const world = await owedWorld("2027-01-20");
    const db = getDb();
    const site = (await db.selectFrom("sites").select("name").where("id", "=", world.siteId).executeTakeFirstOrThrow()).name;
    const tail = "On the night of 2027-01-15 the Sun is down from sunset at 2027-01-15 23:45 UT (20:45 GMT-3) to sunrise at 2027-01-16 09:54 UT (06:54 GMT-3): a payback block must lie wholly within that time. Nothing was saved.";
    const payback = (startsAt: string, endsAt: string) => schedulePayback(db, world.director, { programId: world.programId, telescopeId: world.telescopeId, startsAt: at(startsAt), endsAt: at(endsAt), note: "" });

    await expect(payback("2027-01-16T09:00:00Z", "2027-01-16T10:30:00Z")).rejects.toMatchObject({ message: `That block runs past sunrise at ${site}. ${tail}`, fields: ["endsAt"] });
    await expect(payback("2027-01-15T23:00:00Z", "2027-01-16T00:30:00Z")).rejects.toMatchObject({ message: `That block starts before sunset at ${site}. ${tail}`, fields: ["startsAt"] });
    // One minute either side of the dark time is still refused.
    await expect(payback("2027-01-15T23:44:00Z", "2027-01-16T00:00:00Z")).rejects.toBeInstanceOf(PaybackOutsideNightError);
    await expect(payback("2027-01-16T09:00:00Z", "2027-01-16T09:55:00Z")).rejects.toBeInstanceOf(PaybackOutsideNightError);
    expect(await paybackTraces(world.programId, world.telescopeId)).toEqual({ blocks: 0, repays: 0, changes: 0 });

    // The limits the message names are the limits: both ends on them is accepted.
    await payback("2027-01-15T23:45:00Z", "2027-01-16T00:30:00Z");
    await payback("2027-01-16T09:00:00Z", "2027-01-16T09:54:00Z");
    expect(await paybackTraces(world.programId, world.telescopeId)).toEqual({ blocks: 2, repays: 2, changes: 2 });
  });
});
