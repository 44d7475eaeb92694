import { describe, expect, it } from "vitest";
import { instrumentSchema } from "@/lib/instruments/schemas";
import { partnerSchema } from "@/lib/partners/schemas";

describe("the instrument schema", () => {
  const valid = { telescopeId: "00000000-0000-4000-8000-000000000001", code: "LYRA", name: "Lyra imager", limitingMagnitude: "24.8" };

  it("parses the limiting magnitude", () => {
    expect(instrumentSchema.parse(valid).limitingMagnitude).toBe(24.8);
  });

  it("refuses a missing telescope and an implausible magnitude", () => {
    const r = instrumentSchema.safeParse({ ...valid, telescopeId: "", limitingMagnitude: "40" });
    expect(r.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["telescopeId", "Choose the telescope it is mounted on."],
      ["limitingMagnitude", "Give a limiting magnitude between 0 and 35."],
    ]);
  });
});

describe("the partner schema", () => {
  it("trims and requires both fields", () => {
    expect(partnerSchema.parse({ code: " AUR ", name: " Aurelian Universities " })).toEqual({ code: "AUR", name: "Aurelian Universities" });
    expect(partnerSchema.safeParse({ code: "", name: "" }).error?.issues.map((i) => i.message)).toEqual(["Enter the partner's code.", "Enter the partner's name."]);
  });
});
