import { describe, expect, it } from "vitest";
import { siteSchema, siteFormValues } from "@/lib/sites/schemas";
import { canonicalTimeZone } from "@/lib/sites/time-zone";

const valid = { code: "AQS", name: "Alto Quebrada Station", latitudeDeg: "-30.52", longitudeDeg: "-70.41", heightM: "2310", timeZone: "America/Santiago" };

function fieldErrors(input: unknown): Record<string, string> {
  const result = siteSchema.safeParse(input);
  if (result.success) return {};
  return Object.fromEntries(result.error.issues.map((i) => [i.path.join("."), i.message]));
}

describe("the site schema", () => {
  it("turns form strings into numbers", () => {
    expect(siteSchema.parse(valid)).toEqual({ code: "AQS", name: "Alto Quebrada Station", latitudeDeg: -30.52, longitudeDeg: -70.41, heightM: 2310, timeZone: "America/Santiago" });
  });

  it("refuses latitudes beyond the poles", () => {
    expect(fieldErrors({ ...valid, latitudeDeg: "-90.5" }).latitudeDeg).toMatch(/−90.*90/);
    expect(fieldErrors({ ...valid, latitudeDeg: "91" }).latitudeDeg).toMatch(/−90.*90/);
    expect(siteSchema.parse({ ...valid, latitudeDeg: "90" }).latitudeDeg).toBe(90);
  });

  it("keeps east longitude in (−180, 180], as the database does", () => {
    expect(fieldErrors({ ...valid, longitudeDeg: "181" }).longitudeDeg).toMatch(/east longitude/i);
    expect(fieldErrors({ ...valid, longitudeDeg: "-180" }).longitudeDeg).toMatch(/east longitude/i);
    expect(siteSchema.parse({ ...valid, longitudeDeg: "180" }).longitudeDeg).toBe(180);
  });

  it("refuses unknown time zones, abbreviations and bare offsets", () => {
    expect(fieldErrors({ ...valid, timeZone: "Mars/Olympus_Mons" }).timeZone).toMatch(/Unknown time zone/);
    expect(fieldErrors({ ...valid, timeZone: "CLT" }).timeZone).toMatch(/Unknown time zone/);
    expect(fieldErrors({ ...valid, timeZone: "-03:00" }).timeZone).toMatch(/Unknown time zone/);
    expect(fieldErrors({ ...valid, timeZone: "" }).timeZone).toMatch(/Enter the time zone/);
  });

  it("spells zones the way Intl does and accepts IANA links", () => {
    expect(siteSchema.parse({ ...valid, timeZone: " europe/madrid " }).timeZone).toBe("Europe/Madrid");
    expect(canonicalTimeZone("UTC")).toBe("UTC");
    expect(canonicalTimeZone("Asia/Calcutta")).toBeDefined();
  });

  it("reports every bad field at once, each with its own message", () => {
    const errors = fieldErrors({ code: "", name: "", latitudeDeg: "", longitudeDeg: "x", heightM: "", timeZone: "" });
    expect(Object.keys(errors).sort()).toEqual(["code", "heightM", "latitudeDeg", "longitudeDeg", "name", "timeZone"]);
  });

  it("fills the edit form with values that parse back to the same site", () => {
    const site = { id: "x", code: "SOO", name: "Sierra Orla", latitudeDeg: 38.41, longitudeDeg: -3.72, heightM: 1850, timeZone: "Europe/Madrid", telescopeCount: 1 };
    const { id: _id, telescopeCount: _count, ...fields } = site;
    expect(siteSchema.parse(siteFormValues(site))).toEqual(fields);
  });
});
