// Approving a slot that ends after the target is predicted to fade past the instrument's
// limit (as stored with the request's feasibility check) is refused and changes nothing;
// a slot that ends by then goes through.
import { afterAll, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { DecisionError } from "@/lib/decisions/errors";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { at, makeSubmittedRequest, makeWorld } from "./world";

afterAll(async () => {
  await closeNoticeQueue();
});

async function withFading(requestId: string, fading: { fainterThanLimitAt: string | null; alreadyFainter: boolean }) {
  const snapshot = { telescopes: [], fading: { source: "H-G", instrument: "CAM", limitingMagnitude: 21, magnitudeAtStart: 20.5, coverageEnd: "2027-04-01T00:00:00Z", reason: "", ...fading } };
  await getDb().updateTable("too_requests").set({ feasibility: JSON.stringify(snapshot) }).where("id", "=", requestId).execute();
}

const blockCount = async (telescopeId: string) => (await getDb().selectFrom("blocks").select("id").where("telescope_id", "=", telescopeId).execute()).length;

describe("approving against the fading clock", () => {
  it("refuses a slot ending after the fade, with the time, and approves one ending by then", async () => {
    const world = await makeWorld([["2027-03-02T00:00:00Z", "2027-03-02T08:00:00Z"]]);
    const requestId = await makeSubmittedRequest(world, "Invented fading comet");
    await withFading(requestId, { fainterThanLimitAt: "2027-03-02T03:00:00Z", alreadyFainter: false });

    const late = approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-03-02T02:30:00Z"), end: at("2027-03-02T03:30:00Z") });
    await expect(late).rejects.toBeInstanceOf(DecisionError);
    await expect(late).rejects.toThrow("The target is predicted to fade past CAM's limit V 21.0 at 2027-03-02 03:00 UT: choose a slot that ends by then. Nothing was changed.");
    expect(await blockCount(world.telescopeId)).toBe(1);

    const result = await approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-03-02T02:00:00Z"), end: at("2027-03-02T03:00:00Z") });
    expect(result.displacedMinutes).toBe(60);
  });

  it("refuses every slot when the target was already too faint at filing", async () => {
    const world = await makeWorld([["2027-03-03T00:00:00Z", "2027-03-03T08:00:00Z"]]);
    const requestId = await makeSubmittedRequest(world, "Invented faint comet");
    await withFading(requestId, { fainterThanLimitAt: null, alreadyFainter: true });
    await expect(approveRequest(getDb(), world.director, { requestId, telescopeId: world.telescopeId, start: at("2027-03-03T01:00:00Z"), end: at("2027-03-03T02:00:00Z") })).rejects.toThrow(/already fainter than CAM's limit V 21\.0/);
    expect(await blockCount(world.telescopeId)).toBe(1);
  });
});
