// The PI's home lists what needs them: requests returned for changes (with the director's
// note), drafts not yet filed, and their approved overrides that have not ended — and
// nothing of another PI's, no ended override, nothing still waiting for the director.
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { declineRequest, returnRequest } from "@/lib/decisions/decline";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { listPiAttention } from "@/lib/requests/attention";
import { at, makeSubmittedRequest, makeWorld } from "../decisions/world";

afterAll(async () => {
  await closeNoticeQueue();
});

type World = Awaited<ReturnType<typeof makeWorld>>;

// The home asks with its own clock; these rows are placed around this one.
const NOW = at("2027-02-10T12:00:00Z");

async function draftOf(world: World, targetName: string): Promise<string> {
  const row = await getDb().insertInto("too_requests").values({ pi_user_id: world.piId, program_id: world.tooProgramId, target_name: targetName }).returning("id").executeTakeFirstOrThrow();
  return row.id;
}

async function approved(world: World, targetName: string, start: string, end: string): Promise<string> {
  const id = await makeSubmittedRequest(world, targetName);
  await approveRequest(getDb(), world.director, { requestId: id, telescopeId: world.telescopeId, start: at(start), end: at(end) });
  return id;
}

/** Everything a PI can have: what needs them and what does not. */
async function aPiWithEverything(world: World) {
  const returned = await makeSubmittedRequest(world, "Returned comet");
  await returnRequest(getDb(), world.director, { requestId: returned, note: "Add a finding chart, please." });
  const draft = await draftOf(world, "Half-typed draft");
  const upcoming = await approved(world, "Upcoming override", "2027-02-11T02:00:00Z", "2027-02-11T03:30:00Z");
  const underWay = await approved(world, "Override under way", "2027-02-10T11:30:00Z", "2027-02-10T12:30:00Z");
  const ended = await approved(world, "Ended override", "2027-02-09T02:00:00Z", "2027-02-09T03:00:00Z");
  const waiting = await makeSubmittedRequest(world, "Waiting for the director");
  const declined = await makeSubmittedRequest(world, "Declined request");
  await declineRequest(getDb(), world.director, { requestId: declined, reason: "Too close to the Sun." });
  return { returned, draft, upcoming, underWay, ended, waiting, declined };
}

describe("what needs a PI's attention", () => {
  it("lists their returned requests with the note, their drafts and their overrides not yet ended, and nobody else's", async () => {
    const mine = await makeWorld([]);
    const theirs = await makeWorld([]);
    const r = await aPiWithEverything(mine);
    await aPiWithEverything(theirs);

    const attention = await listPiAttention(getDb(), mine.piId, NOW);

    expect(attention.returned).toEqual([
      {
        id: r.returned,
        targetName: "Returned comet",
        programCode: expect.stringMatching(/-TOO$/),
        note: "Add a finding chart, please.",
        returnedBy: expect.stringContaining("Fixture"),
        returnedAt: expect.any(Date),
        timeZone: "America/Santiago",
      },
    ]);
    expect(attention.drafts.map((d) => [d.id, d.targetName])).toEqual([[r.draft, "Half-typed draft"]]);
    const telescope = await getDb().selectFrom("telescopes").select(["code", "name"]).where("id", "=", mine.telescopeId).executeTakeFirstOrThrow();
    expect(attention.overrides).toEqual([
      {
        requestId: r.underWay,
        targetName: "Override under way",
        programCode: expect.stringMatching(/-TOO$/),
        telescope,
        site: { name: expect.stringMatching(/^Site /), timeZone: "America/Santiago" },
        startsAt: at("2027-02-10T11:30:00Z"),
        endsAt: at("2027-02-10T12:30:00Z"),
      },
      expect.objectContaining({ requestId: r.upcoming, startsAt: at("2027-02-11T02:00:00Z"), endsAt: at("2027-02-11T03:30:00Z") }),
    ]);
  });

  it("drops an override once it has ended, and a returned request once it is filed again", async () => {
    const world = await makeWorld([]);
    const r = await aPiWithEverything(world);
    await getDb().updateTable("too_requests").set({ state: "submitted", submitted_at: NOW }).where("id", "=", r.returned).execute();

    const later = await listPiAttention(getDb(), world.piId, at("2027-02-11T03:30:00Z"));
    expect(later.returned).toEqual([]);
    expect(later.overrides).toEqual([]);
    expect(later.drafts.map((d) => d.id)).toEqual([r.draft]);
  });

  it("is empty for a PI with nothing to do", async () => {
    const world = await makeWorld([]);
    expect(await listPiAttention(getDb(), world.piId, NOW)).toEqual({ returned: [], drafts: [], overrides: [] });
  });
});
