// The ephemeris CSV reader: our column names, any coordinate form the sky parser reads,
// clear messages naming the row and column, and never an exception whatever the input.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseEphemerisCsv, parseEphemerisTime } from "@/lib/requests/ephemeris-csv";
import { MAX_EPHEMERIS_ROWS } from "@/lib/requests/schemas";

describe("parseEphemerisCsv", () => {
  it("reads utc, ra, dec, r_au, delta_au and mag in any column order and coordinate form", () => {
    const csv = [
      "# Invented object 2026 NB1, geocentric",
      "dec,utc,RA,delta_au,r_au,mag,comment",
      "-05:23:28,2026-12-01T22:00:00Z,05:35:17.3,0.31,1.20,17.9,first",
      "−5°20′00″,2026-12-01 23:00,05h36m00s,0.31,1.20,18.0,",
      "-5.25,2026-12-02T01:00:00+01:00,84.1,0.32,1.21,18.1,",
    ].join("\n");
    const { rows, issues } = parseEphemerisCsv(csv);
    expect(issues).toEqual([]);
    expect(rows).toHaveLength(3);
    expect(rows[0]).toEqual({ time: "2026-12-01T22:00:00.000Z", ra: expect.closeTo(83.8221, 4), dec: expect.closeTo(-5.3911, 4), rAu: 1.2, deltaAu: 0.31, magnitude: 17.9 });
    expect(rows[1]?.time).toBe("2026-12-01T23:00:00.000Z");
    expect(rows[1]?.ra).toBeCloseTo(84, 6);
    expect(rows[1]?.dec).toBeCloseTo(-(5 + 20 / 60), 6);
    // A zone offset is honoured: 01:00 at +01:00 is midnight UTC.
    expect(rows[2]?.time).toBe("2026-12-02T00:00:00.000Z");
  });

  it("reads semicolon-separated tables and a byte-order mark, and keeps optional columns optional", () => {
    const { rows, issues } = parseEphemerisCsv("\uFEFFutc;ra;dec\n2026-12-01T00:00:00Z;10:00:00;+20:00:00\n2026-12-01T06:00:00Z;10:00:30;+20:01:00\n");
    expect(issues).toEqual([]);
    expect(rows.map((r) => Object.keys(r).sort())).toEqual([
      ["dec", "ra", "time"],
      ["dec", "ra", "time"],
    ]);
  });

  it("names the row and column of what it cannot read, and uses none of the table", () => {
    const { rows, issues } = parseEphemerisCsv("utc,ra,dec,r_au\n2026-12-01T00:00:00Z,25:00:00,+10:00:00,1\n2026-12-01T01:00,10:00:00,+10:00:00,-3\nyesterday,10:00:00,+10:00:00,1\n");
    expect(rows).toEqual([]);
    expect(issues).toEqual([
      { row: 1, column: "ra", message: expect.stringMatching(/^Row 1: Right ascension "25:00:00": hours must be less than 24/) },
      { row: 2, column: "r_au", message: "Row 2: r_au must be a positive number." },
      { row: 3, column: "utc", message: 'Row 3: "yesterday" is not an ISO 8601 time.' },
    ]);
  });

  it("refuses missing columns, times that do not increase, partial distances and single rows", () => {
    expect(parseEphemerisCsv("time,ra,dec\n2026-12-01T00:00:00Z,1,2\n").issues[0]?.message).toMatch(/^Missing column utc/);
    expect(parseEphemerisCsv("utc,ra,dec\n2026-12-01T01:00:00Z,1,2\n2026-12-01T00:00:00Z,1,2\n").issues[0]?.message).toBe("Row 2: times must increase from row to row.");
    expect(parseEphemerisCsv("utc,ra,dec,delta_au\n2026-12-01T00:00:00Z,1,2,0.1\n2026-12-01T01:00:00Z,1,2,\n").issues[0]?.message).toBe("Give delta_au on every row or on none.");
    expect(parseEphemerisCsv("utc,ra,dec\n2026-12-01T00:00:00Z,1,2\n").issues[0]?.message).toBe("An ephemeris needs at least two rows.");
    expect(parseEphemerisCsv("").issues[0]?.message).toBe("The file is empty.");
  });

  it("refuses tables longer than the limit with a hint", () => {
    const lines = ["utc,ra,dec"];
    const t0 = Date.UTC(2026, 0, 1);
    for (let i = 0; i <= MAX_EPHEMERIS_ROWS; i++) lines.push(`${new Date(t0 + i * 60_000).toISOString()},1,2`);
    expect(parseEphemerisCsv(lines.join("\n")).issues[0]?.message).toMatch(/use at most 5000 \(a coarser step is fine/);
  });

  it("refuses impossible dates instead of rolling them over", () => {
    expect(parseEphemerisTime("2026-02-30T00:00:00Z")).toBeNull();
    expect(parseEphemerisTime("2026-04-31 12:00")).toBeNull();
    expect(parseEphemerisTime("2026-12-01T24:00:00Z")).toBeNull();
    expect(parseEphemerisTime("2026-12-01T10:00:00-0300")?.toISOString()).toBe("2026-12-01T13:00:00.000Z");
  });

  it("never throws, whatever the input", () => {
    fc.assert(
      fc.property(fc.string({ unit: "binary", maxLength: 400 }), (text) => {
        const result = parseEphemerisCsv(text);
        expect(Array.isArray(result.rows)).toBe(true);
        expect(Array.isArray(result.issues)).toBe(true);
      }),
      { numRuns: 400 },
    );
    const cell = fc.oneof(fc.string({ maxLength: 12 }), fc.double().map(String), fc.constantFrom("", "-", "+", ":", "12:34:56", "−0°30′", "1e400", "NaN"));
    const table = fc.array(fc.array(cell, { minLength: 0, maxLength: 7 }), { maxLength: 12 }).map((rows) => ["utc,ra,dec,r_au,delta_au,mag", ...rows.map((r) => r.join(","))].join("\n"));
    fc.assert(
      fc.property(table, (text) => {
        const { rows, issues } = parseEphemerisCsv(text);
        // Either a usable table or reasons, never both and never neither.
        expect(rows.length === 0 ? issues.length > 0 : issues.length === 0).toBe(true);
      }),
      { numRuns: 400 },
    );
  });

  it("gives back exactly the rows it was given, for any valid table", () => {
    const row = fc.record({
      raSeconds: fc.integer({ min: 0, max: 24 * 3600 - 1 }),
      decArcsec: fc.integer({ min: -90 * 3600, max: 90 * 3600 }),
      stepMinutes: fc.integer({ min: 1, max: 600 }),
    });
    fc.assert(
      fc.property(fc.array(row, { minLength: 2, maxLength: 30 }), (spec) => {
        let t = Date.UTC(2026, 11, 1);
        const lines = ["utc,ra,dec"];
        for (const r of spec) {
          t += r.stepMinutes * 60_000;
          const h = Math.floor(r.raSeconds / 3600);
          const m = Math.floor((r.raSeconds % 3600) / 60);
          const s = r.raSeconds % 60;
          const sign = r.decArcsec < 0 ? "-" : "+";
          const d = Math.abs(r.decArcsec);
          lines.push(`${new Date(t).toISOString()},${h} ${m} ${s},${sign}${Math.floor(d / 3600)}:${Math.floor((d % 3600) / 60)}:${d % 60}`);
        }
        const { rows, issues } = parseEphemerisCsv(lines.join("\n"));
        expect(issues).toEqual([]);
        expect(rows).toHaveLength(spec.length);
        rows.forEach((got, i) => {
          expect(got.ra).toBeCloseTo((spec[i]!.raSeconds / 3600) * 15, 9);
          expect(got.dec).toBeCloseTo(spec[i]!.decArcsec / 3600, 9);
        });
      }),
      { numRuns: 200 },
    );
  });
});
