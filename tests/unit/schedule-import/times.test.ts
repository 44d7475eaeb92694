import { describe, expect, it } from "vitest";
import { parseImportTime } from "@/lib/schedule/import/times";

const instant = (raw: string, zone = "") => {
  const r = parseImportTime(raw, zone);
  return r.ok ? r.instant.toISOString() : r.failure.kind;
};

describe("reading a start or end cell", () => {
  it("takes ISO 8601 with Z or an offset, whatever the row's zone", () => {
    expect(instant("2027-03-01T23:00:00Z")).toBe("2027-03-01T23:00:00.000Z");
    expect(instant("2027-03-01T20:00-03:00", "Europe/Madrid")).toBe("2027-03-01T23:00:00.000Z");
    expect(instant("2027-03-01 20:00:00+0530")).toBe("2027-03-01T14:30:00.000Z");
    expect(instant("2027-03-01T23:00:00.250Z")).toBe("2027-03-01T23:00:00.250Z");
  });

  it("reads a local time in the row's zone", () => {
    expect(instant("2027-03-01 20:00", "America/Santiago")).toBe("2027-03-01T23:00:00.000Z");
    expect(instant("2027-07-01T22:00", "Europe/Madrid")).toBe("2027-07-01T20:00:00.000Z");
  });

  it("names what is wrong", () => {
    expect(instant("")).toBe("missing");
    expect(instant("tomorrow night")).toBe("bad");
    expect(instant("2027-02-30 20:00", "UTC")).toBe("bad");
    expect(instant("2027-03-01 24:00", "UTC")).toBe("bad");
    expect(instant("2027-03-01T20:00+19:00")).toBe("bad");
    expect(instant("01/03/2027 20:00", "UTC")).toBe("bad");
    expect(instant("2027-03-01 20:00")).toBe("zone_missing");
    expect(instant("2027-03-01 20:00", "Andes/Nowhere")).toBe("zone_unknown");
    expect(instant("2027-03-28 02:30", "Europe/Madrid")).toBe("nonexistent");
    expect(instant("2027-10-31 02:30", "Europe/Madrid")).toBe("ambiguous");
  });
});
