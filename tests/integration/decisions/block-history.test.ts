// After an approval, the schedule's block detail tells the story: the override block says
// it was placed for that request, the displaced block that it was shortened or split, the
// split-off part where it came from — each with the director who approved it.
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { getBlockDetail } from "@/lib/schedule/calendar-queries";
import { at, makeSubmittedRequest, makeWorld } from "./world";

afterAll(async () => {
  await closeNoticeQueue();
});

async function historyAt(telescopeId: string, startIso: string) {
  const block = await getDb().selectFrom("blocks").select("id").where("telescope_id", "=", telescopeId).where("starts_at", "=", at(startIso)).executeTakeFirstOrThrow();
  const detail = await getBlockDetail(getDb(), block.id);
  return detail!.history.map((h) => ({ action: h.action, actor: h.actorName, target: (h.details as { targetName?: string }).targetName }));
}

describe("a block's history after an override", () => {
  it("records the override, the split and the trim on the blocks they changed", async () => {
    const world = await makeWorld([["2027-03-01T00:00:00Z", "2027-03-01T04:00:00Z"], ["2027-03-01T04:00:00Z", "2027-03-01T08:00:00Z"]]);
    const requestId = await makeSubmittedRequest(world, "Invented nova");
    await approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-03-01T01:00:00Z"), end: at("2027-03-01T02:00:00Z") });
    const second = await makeSubmittedRequest(world, "Invented flare");
    await approveRequest(getDb(), world.director, { requestId: second, telescopeId: world.telescopeId, start: at("2027-03-01T03:30:00Z"), end: at("2027-03-01T04:30:00Z") });

    const by = world.director.name;
    expect(await historyAt(world.telescopeId, "2027-03-01T00:00:00Z")).toEqual([{ action: "block.override_split", actor: by, target: "Invented nova" }]);
    // The part after the first override was split off, then trimmed by the second.
    expect(await historyAt(world.telescopeId, "2027-03-01T02:00:00Z")).toEqual([
      { action: "block.override_remainder", actor: by, target: "Invented nova" },
      { action: "block.override_trim", actor: by, target: "Invented flare" },
    ]);
    expect(await historyAt(world.telescopeId, "2027-03-01T01:00:00Z")).toEqual([{ action: "block.override_create", actor: by, target: "Invented nova" }]);
    expect(await historyAt(world.telescopeId, "2027-03-01T04:30:00Z")).toEqual([{ action: "block.override_trim", actor: by, target: "Invented flare" }]);
  });
});
