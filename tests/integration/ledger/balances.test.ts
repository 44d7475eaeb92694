import { afterAll, afterEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { ledgerCsv } from "@/lib/ledger/csv";
import { getLedger } from "@/lib/ledger/service";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { at, makeSubmittedRequest, makeWorld } from "../decisions/world";
import { makeUser } from "../fixtures";
import { setCreditRatio } from "./helpers";

afterEach(async () => {
  await setCreditRatio(1);
});
afterAll(async () => {
  await closeNoticeQueue();
});

describe("ledger balances follow the consortium's policy", () => {
  it("charges the ToO program the slot, credits the displaced program displaced × ratio (1:1, then 2:1), and sums per partner and semester", async () => {
    const world = await makeWorld([["2027-03-01T00:00:00Z", "2027-03-01T04:00:00Z"], ["2027-03-01T04:00:00Z", "2027-03-01T08:00:00Z"]]);
    const db = getDb();
    const first = await makeSubmittedRequest(world, "Object one");
    await approveRequest(db, world.director, { requestId: first, telescopeId: world.telescopeId, start: at("2027-03-01T01:00:00Z"), end: at("2027-03-01T02:30:00Z") });

    await setCreditRatio(2);
    const second = await makeSubmittedRequest(world, "Object two");
    // 30 min of the first block and 30 of the second: 60 displaced, 120 credited.
    await approveRequest(db, world.director, { requestId: second, telescopeId: world.telescopeId, start: at("2027-03-01T03:30:00Z"), end: at("2027-03-01T04:30:00Z") });

    const ledger = await getLedger(db, world.director);
    const displaced = ledger.programs.find((p) => p.programId === world.programId)!;
    const too = ledger.programs.find((p) => p.programId === world.tooProgramId)!;
    expect(displaced).toMatchObject({ creditedMinutes: 90 + 120, repaidMinutes: 0, owedMinutes: 210, chargedMinutes: 0 });
    expect(too).toMatchObject({ chargedMinutes: 150, creditedMinutes: 0, owedMinutes: 0 });
    expect(ledger.creditRatio).toBe(2);

    // The partner and semester lines are the sums of their programs' lines.
    const partner = ledger.partners.find((p) => p.partnerId === displaced.partnerId && p.semesterId === displaced.semesterId)!;
    const sameLines = ledger.programs.filter((p) => p.partnerId === partner.partnerId && p.semesterId === partner.semesterId);
    expect(partner.creditedMinutes).toBe(sameLines.reduce((s, p) => s + p.creditedMinutes, 0));
    expect(partner.chargedMinutes).toBe(sameLines.reduce((s, p) => s + p.chargedMinutes, 0));
    const semester = ledger.semesters.find((s) => s.semesterId === displaced.semesterId)!;
    expect(semester.owedMinutes).toBe(ledger.programs.filter((p) => p.semesterId === semester.semesterId).reduce((s, p) => s + p.owedMinutes, 0));
    expect(ledger.totals.creditedMinutes).toBe(ledger.programs.reduce((s, p) => s + p.creditedMinutes, 0));

    const csv = ledgerCsv(ledger.programs.filter((p) => p.semesterId === semester.semesterId));
    expect(csv.split("\r\n")[0]).toBe("semester,partner,program,title,charged_minutes,credited_minutes,repaid_minutes,owed_minutes,owed_hours");
    expect(csv).toContain(`,${displaced.programCode},Fixture program,0,210,0,210,3.5`);
  });

  it("shows a PI and an observer only their own programs; a director and an admin everything", async () => {
    const world = await makeWorld([["2027-03-02T00:00:00Z", "2027-03-02T04:00:00Z"]]);
    const db = getDb();
    const requestId = await makeSubmittedRequest(world);
    await approveRequest(db, world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-03-02T01:00:00Z"), end: at("2027-03-02T02:00:00Z") });
    const stranger = await makeUser(["pi", "observer"]);
    expect((await getLedger(db, { id: stranger.id, roles: ["pi", "observer"] })).programs).toEqual([]);
    // The observer lost time on the program: they see it, and only what touches them.
    const observed = await getLedger(db, { id: world.observer.id, roles: ["observer"] });
    expect(observed.programs.map((p) => p.programId)).toEqual([world.programId]);
    expect(observed.scope).toBe("mine");
    // The PI leads both the displaced program and the ToO program in this fixture.
    const pi = await getLedger(db, { id: world.piId, roles: ["pi"] });
    expect(pi.programs.map((p) => p.programId).sort()).toEqual([world.programId, world.tooProgramId].sort());
    const admin = await getLedger(db, { id: stranger.id, roles: ["admin"] });
    expect(admin.scope).toBe("all");
    expect(admin.programs.length).toBeGreaterThanOrEqual(2);
  });
});
