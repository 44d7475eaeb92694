// The request schema shared by the form and the API: messages a PI can act on, times
// without a zone read as UT, and drafts that keep whatever was typed.
import { describe, expect, it } from "vitest";
import { zodFields } from "@/lib/api/errors";
import { draftFields } from "@/lib/requests/fields-map";
import { emptyRequestForm, requestFormValues } from "@/lib/requests/form-values";
import { draftInputSchema, requestSchema } from "@/lib/requests/schemas";

const ID = "00000000-0000-4000-8000-000000000001";
const NOW = new Date("2027-03-10T15:02:00Z");

function filled() {
  const form = emptyRequestForm(NOW, [ID]);
  return {
    ...form,
    targetName: "Invented transient",
    target: { ...form.target, ra: "05 35 17.3", dec: "-05 23 28" },
    telescopeIds: [ID],
    instrumentId: ID,
    justification: "Photometry before it fades below reach of the 1.6 m.",
  };
}

describe("requestSchema", () => {
  it("accepts a filled-in form: sexagesimal coordinates, UT wall-clock times, string numbers", () => {
    const parsed = requestSchema.parse(filled());
    expect(parsed.target.ra).toBeCloseTo(83.8221, 4);
    expect(parsed.target.dec).toBeCloseTo(-5.3911, 4);
    expect(parsed.earliestStart.toISOString()).toBe("2027-03-10T15:05:00.000Z");
    expect(parsed.durationMinutes).toBe(60);
    expect(parsed.constraints).toEqual({ darkness: "nautical", maxAirmass: 2, minMoonSeparationDeg: undefined, maxMoonIllumination: undefined });
  });

  it("answers one message per field, naming the character at fault in a coordinate", () => {
    const result = requestSchema.safeParse({ ...filled(), target: { kind: "fixed", ra: "05:3x:17", dec: "" }, instrumentId: "", justification: "short" });
    expect(result.success).toBe(false);
    expect(zodFields(result.error!)).toEqual({
      "target.ra": 'Right ascension "05:3x:17": an unexpected character \'x\' (at character 5).',
      "target.dec": "Enter the declination, e.g. −05:23:28.",
      instrumentId: "Choose an instrument.",
      justification: "Give the scientific justification (at least 20 characters).",
    });
    // Coordinates typed before switching to an ephemeris do not block it.
    const rows = [
      { time: "2027-03-10T00:00:00Z", ra: 10, dec: 10 },
      { time: "2027-03-11T00:00:00Z", ra: 11, dec: 10 },
    ];
    expect(requestSchema.safeParse({ ...filled(), target: { kind: "ephemeris", ra: "05:3x", dec: "garbage", ephemeris: rows } }).success).toBe(true);
  });

  it("checks the window: order, length, and time needed", () => {
    const result = requestSchema.safeParse({ ...filled(), latestEnd: "2027-03-10T15:00", deadline: "2027-03-10T14:00", durationMinutes: "30" });
    expect(zodFields(result.error!)).toEqual({
      latestEnd: "The latest end must come after the earliest start.",
      deadline: "The deadline must come after the earliest start.",
    });
    const tooLong = requestSchema.safeParse({ ...filled(), deadline: "2027-03-10T15:35", durationMinutes: "60" });
    expect(zodFields(tooLong.error!)).toEqual({ durationMinutes: "The time needed is longer than the window before the deadline." });
    const month = requestSchema.safeParse({ ...filled(), latestEnd: "2027-04-20T00:00" });
    expect(zodFields(month.error!)).toEqual({ latestEnd: "Keep the window within 31 days of the earliest start." });
  });

  it("requires ephemeris rows for a moving target, and r and Δ for H", () => {
    const result = requestSchema.safeParse({ ...filled(), target: { kind: "ephemeris", ephemeris: [{ time: "2027-03-10T00:00:00Z", ra: 10, dec: 10 }] } });
    expect(zodFields(result.error!)).toEqual({ "target.ephemeris": "Upload an ephemeris table with at least two rows." });
    const rows = [
      { time: "2027-03-10T00:00:00Z", ra: 10, dec: 10 },
      { time: "2027-03-11T00:00:00Z", ra: 11, dec: 10 },
    ];
    const withH = requestSchema.safeParse({ ...filled(), target: { kind: "ephemeris", ephemeris: rows, hMag: "18" } });
    expect(zodFields(withH.error!)).toEqual({ "target.hMag": "The fading clock from H needs r_au and delta_au on every ephemeris row." });
  });
});

describe("drafts", () => {
  it("keep typed text and whatever parses, and drop the rest", () => {
    const fields = draftFields(draftInputSchema.parse({ targetName: "  Half typed ", target: { kind: "fixed", ra: "05:3", dec: "-95" }, durationMinutes: "soon", telescopeIds: ["x", ID] }));
    expect(fields).toMatchObject({ targetName: "Half typed", raText: "05:3", decText: "-95", raDeg: 75.75, decDeg: null, durationMinutes: null, telescopeIds: [ID] });
  });

  it("show a stored draft back as it was typed", () => {
    const values = requestFormValues({
      id: ID,
      piUserId: ID,
      piName: "PI",
      programId: null,
      programCode: null,
      programTitle: null,
      source: "form",
      state: "draft",
      targetName: "T",
      target: { kind: "fixed", raText: "05:3", decText: "", raDeg: 83.25, decDeg: null, ephemeris: null, hMag: null, gSlope: null },
      telescopes: [],
      instrumentId: null,
      instrumentCode: null,
      durationMinutes: null,
      earliestStart: new Date("2027-03-10T22:00:00Z"),
      latestEnd: null,
      deadline: null,
      urgency: null,
      constraints: { maxAirmass: 2, darkness: "astronomical", minMoonSeparationDeg: null, maxMoonIllumination: null },
      justification: "",
      feasibility: null,
      directorNote: null,
      createdAt: NOW,
      updatedAt: NOW,
      submittedAt: null,
    });
    expect(values).toMatchObject({ programId: "", target: { ra: "05:3", dec: "" }, earliestStart: "2027-03-10T22:00", latestEnd: "", urgency: "tonight", constraints: { maxAirmass: "2", darkness: "astronomical" } });
  });
});
