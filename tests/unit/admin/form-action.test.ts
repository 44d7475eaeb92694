import { describe, expect, it } from "vitest";
import { z } from "zod";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { parseRecordId, runFormAction } from "@/lib/actions/form-action";

describe("runFormAction", () => {
  it("puts a FieldError beside its field and in the message", async () => {
    const answer = await runFormAction(async () => {
      throw new FieldError("code", "A site with the code AQS already exists.");
    });
    expect(answer).toEqual({ ok: false, message: "A site with the code AQS already exists.", fieldErrors: { code: "A site with the code AQS already exists." } });
  });

  it("answers zod failures field by field, and in-use refusals as a message", async () => {
    const zodAnswer = await runFormAction(async () => {
      z.object({ latitudeDeg: z.number().max(90, "Too far north.") }).parse({ latitudeDeg: 91 });
      return { ok: true };
    });
    expect(zodAnswer).toEqual({ ok: false, message: "Some fields need attention.", fieldErrors: { latitudeDeg: "Too far north." } });
    const inUse = await runFormAction(async () => {
      throw new RecordInUseError("Site AQS still has 2 telescopes.");
    });
    expect(inUse).toEqual({ ok: false, message: "Site AQS still has 2 telescopes." });
  });

  it("lets unexpected errors through to error.tsx", async () => {
    await expect(runFormAction(async () => Promise.reject(new Error("boom")))).rejects.toThrow("boom");
  });
});

describe("parseRecordId", () => {
  it("treats a malformed id as a record that is gone", () => {
    expect(parseRecordId("5f0c2b7e-8d1a-4c3b-a2e1-9f8e7d6c5b4a", "site")).toBe("5f0c2b7e-8d1a-4c3b-a2e1-9f8e7d6c5b4a");
    expect(() => parseRecordId("../etc", "site")).toThrow(RecordNotFoundError);
  });
});
