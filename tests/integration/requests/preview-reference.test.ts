// The preview's telescopes and instruments are read at most every REFERENCE_REUSE_MS.
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { previewReference, REFERENCE_REUSE_MS } from "@/lib/requests/feasibility/reference-cache";
import { makeTelescopeAndProgram } from "../fixtures";

describe("the preview's reference data", () => {
  it("answers in the order asked, marks unknown ids, and sees an edit once REFERENCE_REUSE_MS has passed", async () => {
    const { telescopeId } = await makeTelescopeAndProgram();
    const unknown = "00000000-0000-4000-8000-00000000abcd";
    const t0 = Date.now() + 60_000; // later than anything kept by earlier files
    const first = await previewReference(getDb(), [unknown, telescopeId], undefined, t0);
    expect(first.telescopes[0]).toBeUndefined();
    expect(first.telescopes[1]?.id).toBe(telescopeId);
    const before = first.telescopes[1]!.minAltitudeDeg;

    await getDb().updateTable("telescopes").set({ min_altitude_deg: before + 5 }).where("id", "=", telescopeId).execute();
    expect((await previewReference(getDb(), [telescopeId], undefined, t0 + 1)).telescopes[0]?.minAltitudeDeg).toBe(before);
    expect((await previewReference(getDb(), [telescopeId], undefined, t0 + REFERENCE_REUSE_MS + 1)).telescopes[0]?.minAltitudeDeg).toBe(before + 5);
  });

  it("reads again at once for a telescope added since", async () => {
    const t0 = Date.now() + 120_000;
    const { telescopeId: old } = await makeTelescopeAndProgram();
    await previewReference(getDb(), [old], undefined, t0);
    const { telescopeId: added } = await makeTelescopeAndProgram();
    expect((await previewReference(getDb(), [added], undefined, t0 + 1)).telescopes[0]?.id).toBe(added);
  });
});
