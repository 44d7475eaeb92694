import { describe, expect, it } from "vitest";
import { emptyTelescopeForm, telescopeSchema } from "@/lib/telescopes/schemas";

const SITE = "0b9a4c1e-3f5d-4a8b-9c2d-1e2f3a4b5c6d";
const ASSISTANT = "5f0c2b7e-8d1a-4c3b-a2e1-9f8e7d6c5b4a";
const valid = { ...emptyTelescopeForm, siteId: SITE, code: "AQ41", name: "Quebrada 4.1 m", apertureM: "4.1", assistantUserIds: [ASSISTANT, ASSISTANT] };

const errorsOf = (input: unknown) => {
  const r = telescopeSchema.safeParse(input);
  return r.success ? {} : Object.fromEntries(r.error.issues.map((i) => [i.path.join("."), i.message]));
};

describe("the telescope schema", () => {
  it("accepts the database's defaults and drops a doubled assistant", () => {
    const parsed = telescopeSchema.parse(valid);
    expect(parsed).toMatchObject({ apertureM: 4.1, minAltitudeDeg: 20, maxAirmass: 2.9, sunAvoidanceDeg: 45, hourAngleMinH: -12, hourAngleMaxH: 12, setupMinutes: 10 });
    expect(parsed.assistantUserIds).toEqual([ASSISTANT]);
  });

  it("refuses a highest airmass below 1, the zenith", () => {
    expect(errorsOf({ ...valid, maxAirmass: "0.9" }).maxAirmass).toMatch(/Airmass is 1 at the zenith/);
  });

  it("keeps hour-angle limits on their side of the meridian", () => {
    expect(errorsOf({ ...valid, hourAngleMinH: "1" }).hourAngleMinH).toMatch(/−12 h and 0 h/);
    expect(errorsOf({ ...valid, hourAngleMaxH: "-1" }).hourAngleMaxH).toMatch(/0 h and 12 h/);
  });

  it("refuses a zero aperture, altitudes over 90°, fractional setup minutes and a missing site", () => {
    const errors = errorsOf({ ...valid, siteId: "", apertureM: "0", minAltitudeDeg: "95", sunAvoidanceDeg: "181", setupMinutes: "7.5" });
    expect(errors).toMatchObject({
      siteId: "Choose the site.",
      apertureM: expect.stringMatching(/above 0/),
      minAltitudeDeg: expect.stringMatching(/0° and 90°/),
      sunAvoidanceDeg: expect.stringMatching(/0° and 180°/),
      setupMinutes: expect.stringMatching(/whole minutes/i),
    });
  });
});
