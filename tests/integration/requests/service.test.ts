// The request service against the real database: a draft saved as it is typed, filed
// after the feasibility check, withdrawn, with every step in the history; refusals for
// sun avoidance and for no window before the deadline, with their reasons.
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { RequestFieldError, RequestNotFoundError, RequestRefusedError, RequestStateError } from "@/lib/requests/errors";
import { findRequestById, listRequestEvents } from "@/lib/requests/queries";
import { draftInputSchema, requestSchema } from "@/lib/requests/schemas";
import { fileRequest, findRequestForViewer, saveDraft, withdrawRequest } from "@/lib/requests/service";
import type { Role } from "@/db/types";
import { makeUser } from "../fixtures";
import { antiSolar, atTheSun, makeRequestWorld, NEVER_RISES, requestBody } from "./fixtures";

// A fixed "now" keeps the sky the same on every run: 15:00 UT is late morning in Chile.
const NOW = new Date("2027-03-10T15:00:00Z");
const actor = (id: string, roles: Role[] = ["pi"]) => ({ id, roles });

afterAll(async () => {
  await closeNoticeQueue();
});

describe("a request's life: draft, submit, withdraw", () => {
  it("keeps what was typed, files it after the check, withdraws it, and records each step", async () => {
    const world = await makeRequestWorld();
    const director = await makeUser(["director"]);
    const db = getDb();
    const pi = actor(world.piId);
    const body = requestBody(world, NOW, antiSolar(NOW));

    // The first autosave: a name and half-typed coordinates.
    const { id } = await saveDraft(db, pi, null, { targetName: "Fixture transient", target: { kind: "fixed", ra: "12:3", dec: "" } });
    let stored = await findRequestById(db, id);
    expect(stored).toMatchObject({ state: "draft", targetName: "Fixture transient", target: { raText: "12:3", raDeg: 180 * (12.05 / 12) } });

    // Later autosaves fill in the rest; an unparseable value is dropped, not refused.
    await saveDraft(db, pi, id, draftInputSchema.parse({ ...body, durationMinutes: "soon" }));
    stored = await findRequestById(db, id);
    expect(stored?.durationMinutes).toBeNull();
    expect(stored?.telescopes.map((t) => t.id)).toEqual([world.telescopeId]);

    const filed = await fileRequest(db, pi, requestSchema.parse(body), { draftId: id, source: "form", now: NOW, typed: body.target });
    expect(filed.id).toBe(id);
    expect(filed.report.verdict).toBe("feasible");
    stored = await findRequestById(db, id);
    expect(stored).toMatchObject({ state: "submitted", submittedAt: NOW, durationMinutes: 60, target: { raText: body.target.ra } });
    expect(stored?.feasibility?.verdict).toBe("feasible");
    expect(stored?.feasibility?.telescopes[0]?.firstSlot).not.toBeNull();

    // Directors are told, inside the same transaction.
    const notices = await db.selectFrom("notifications").select("link").where("user_id", "=", director.id).where("event", "=", "request_submitted").execute();
    expect(notices.map((n) => n.link)).toContain(`/review/${id}`);

    // Filed means read-only, except withdrawal.
    await expect(saveDraft(db, pi, id, { targetName: "Changed" })).rejects.toBeInstanceOf(RequestStateError);
    await withdrawRequest(db, pi, id, "Weather at both sites.");
    await expect(withdrawRequest(db, pi, id)).rejects.toThrow(/already been withdrawn/);

    const history = await listRequestEvents(db, id);
    expect(history.map((e) => [e.fromState, e.toState])).toEqual([
      [null, "draft"],
      ["draft", "submitted"],
      ["submitted", "withdrawn"],
    ]);
    expect(history[2]?.note).toBe("Weather at both sites.");
    expect(history.every((e) => e.actorName?.startsWith("Fixture"))).toBe(true);
  });

  it("cannot withdraw a draft, nor touch someone else's request", async () => {
    const world = await makeRequestWorld();
    const other = await makeUser(["pi"]);
    const db = getDb();
    const { id } = await saveDraft(db, actor(world.piId), null, { targetName: "Mine" });
    await expect(withdrawRequest(db, actor(world.piId), id)).rejects.toThrow(/nothing to withdraw/);
    await expect(saveDraft(db, actor(other.id), id, { targetName: "Theirs" })).rejects.toBeInstanceOf(RequestNotFoundError);
    await expect(withdrawRequest(db, actor(other.id), id)).rejects.toBeInstanceOf(RequestNotFoundError);
  });
});

describe("the feasibility check refuses, with the reason", () => {
  it("refuses a target inside the telescope's sun avoidance limit and files nothing", async () => {
    const world = await makeRequestWorld();
    const db = getDb();
    const pi = actor(world.piId);
    const body = requestBody(world, NOW, atTheSun(NOW));
    const { id } = await saveDraft(db, pi, null, draftInputSchema.parse(body));
    const refusal = await fileRequest(db, pi, requestSchema.parse(body), { draftId: id, source: "form", now: NOW }).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(RequestRefusedError);
    const reasons = (refusal as RequestRefusedError).report.reasons;
    expect(reasons[0]).toMatch(new RegExp(`^Refused for sun avoidance on ${world.telescopeCode}: the target comes within \\d+\\.\\d° of the Sun, inside this telescope's 40\\.0° limit\\.`));
    expect(reasons[0]).toContain(`Remove ${world.telescopeCode} from the acceptable telescopes`);
    expect((await findRequestById(db, id))?.state).toBe("draft");
    expect((await listRequestEvents(db, id)).map((e) => e.toState)).toEqual(["draft"]);
  });

  it("refuses a target with no observable window before the deadline", async () => {
    const world = await makeRequestWorld();
    const db = getDb();
    const body = requestSchema.parse(requestBody(world, NOW, NEVER_RISES));
    const refusal = await fileRequest(db, actor(world.piId), body, { source: "api", now: NOW }).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(RequestRefusedError);
    expect((refusal as RequestRefusedError).report.reasons).toEqual([
      "No observable window of 60 min before the deadline on any acceptable telescope.",
      expect.stringMatching(new RegExp(`^No observable window on ${world.telescopeCode} between 2027-03-10 15:00 UT and the deadline 2027-03-13 15:00 UT\\.$`)),
    ]);
  });

  it("refuses a deadline that leaves only daylight, even for a target that is up all night", async () => {
    const world = await makeRequestWorld();
    const inThreeHours = new Date(NOW.getTime() + 3 * 3_600_000).toISOString();
    const body = requestSchema.parse(requestBody(world, NOW, antiSolar(NOW), { latestEnd: inThreeHours, deadline: inThreeHours }));
    const refusal = await fileRequest(getDb(), actor(world.piId), body, { source: "api", now: NOW }).catch((e: unknown) => e);
    expect(refusal).toBeInstanceOf(RequestRefusedError);
    expect((refusal as RequestRefusedError).message).toMatch(/No observable window of 60 min before the deadline/);
  });
});

describe("what a request may refer to, and who may see it", () => {
  it("files only on the PI's own ToO program and an instrument on an acceptable telescope", async () => {
    const world = await makeRequestWorld();
    const plain = await makeRequestWorld({ tooAllowed: false });
    const db = getDb();
    const pi = actor(world.piId);
    const mine = (overrides: Parameters<typeof requestBody>[3]) => requestSchema.parse(requestBody(world, NOW, antiSolar(NOW), overrides));
    await expect(fileRequest(db, pi, mine({ programId: plain.programId }), { source: "form", now: NOW })).rejects.toMatchObject({
      fields: { programId: "Choose one of your own programs." },
    });
    await expect(fileRequest(db, actor(plain.piId), requestSchema.parse(requestBody(plain, NOW, antiSolar(NOW))), { source: "form", now: NOW })).rejects.toThrow(
      /has no target-of-opportunity time/,
    );
    await expect(fileRequest(db, pi, mine({ instrumentId: plain.instrumentId }), { source: "form", now: NOW })).rejects.toBeInstanceOf(RequestFieldError);
  });

  it("shows a PI only their own requests, and a director any filed one but no drafts", async () => {
    const world = await makeRequestWorld();
    const other = await makeUser(["pi"]);
    const director = await makeUser(["director"]);
    const db = getDb();
    const { id: filedId } = await fileRequest(db, actor(world.piId), requestSchema.parse(requestBody(world, NOW, antiSolar(NOW))), { source: "api", now: NOW });
    const { id: draftId } = await saveDraft(db, actor(world.piId), null, { targetName: "Draft" });
    expect(await findRequestForViewer(db, actor(world.piId), filedId)).toBeDefined();
    expect(await findRequestForViewer(db, actor(other.id), filedId)).toBeUndefined();
    expect(await findRequestForViewer(db, actor(director.id, ["director"]), filedId)).toBeDefined();
    expect(await findRequestForViewer(db, actor(director.id, ["director"]), draftId)).toBeUndefined();
  });
});
