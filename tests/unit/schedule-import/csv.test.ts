import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { parseScheduleCsv } from "@/lib/schedule/import/csv";

const HEADER = "telescope,program,observer_email,instrument,kind,start,end,time_zone,notes";

describe("the schedule CSV reader", () => {
  it("reads rows with the line each starts on, across quoted line breaks and blank lines", () => {
    const text = [
      HEADER,
      "AQ-24,P-01,ana@example.test,CAM,science,2027-03-01 20:00,2027-03-02 02:00,America/Santiago,",
      "",
      'AQ-24,P-02,,,engineering,2027-03-02T23:00:00Z,2027-03-03T05:00:00Z,,"two',
      'lines, with ""quotes"""',
      "AQ-24,P-03,,,,2027-03-04T23:00:00Z,2027-03-05T05:00:00Z,,",
    ].join("\r\n");
    const { rows, problems, format } = parseScheduleCsv(text);
    expect(format).toBe("csv");
    expect(problems).toEqual([]);
    expect(rows.map((r) => r.line)).toEqual([2, 4, 6]);
    expect(rows[0]).toMatchObject({ telescope: "AQ-24", program: "P-01", observerEmail: "ana@example.test", instrument: "CAM", kind: "science", start: "2027-03-01 20:00", timeZone: "America/Santiago" });
    expect(rows[1]?.notes).toBe('two\r\nlines, with "quotes"');
    expect(rows[2]?.kind).toBe("");
  });

  it("matches headers loosely, in any order, and ignores a byte-order mark", () => {
    const { rows, problems } = parseScheduleCsv("\uFEFF Start ;End;Telescope;Program;Time Zone\n2027-03-01 20:00;2027-03-01 23:00;AQ-24;P-01;UTC\n");
    expect(problems).toEqual([]);
    expect(rows[0]).toMatchObject({ start: "2027-03-01 20:00", end: "2027-03-01 23:00", telescope: "AQ-24", timeZone: "UTC", line: 2 });
  });

  it("reports unknown and missing columns on line 1 and reads no rows", () => {
    const { rows, problems } = parseScheduleCsv("telscope,program,start\nAQ-24,P-01,2027-03-01T20:00Z\n");
    expect(rows).toEqual([]);
    expect(problems.map((p) => p.line)).toEqual([1, 1]);
    expect(problems[0]?.reason).toMatch(/Unknown column "telscope"/);
    expect(problems[1]?.reason).toMatch(/Missing columns: telescope, end/);
  });

  it("reports a row with too many cells and an unterminated quote by line", () => {
    const text = `${HEADER}\nA,B,,,,2027-03-01T20:00Z,2027-03-01T21:00Z,,,extra\nA,B,,,,2027-03-02T20:00Z,2027-03-02T21:00Z,,fine\nA,B,,,,2027-03-03T20:00Z,2027-03-03T21:00Z,,"never closed\nA,B\n`;
    const { rows, problems } = parseScheduleCsv(text);
    expect(rows.map((r) => r.line)).toEqual([3]);
    expect(problems).toEqual([
      { line: 2, reason: expect.stringMatching(/10 cells but the header names 9/) },
      { line: 4, reason: expect.stringMatching(/never closed/) },
    ]);
  });

  it("undoes the export's formula escaping", () => {
    const { rows } = parseScheduleCsv(`${HEADER}\nA,B,,,,2027-03-01T20:00Z,2027-03-01T21:00Z,,'=1+1\n`);
    expect(rows[0]?.notes).toBe("=1+1");
  });

  it("says so when the file is empty or has no rows", () => {
    expect(parseScheduleCsv("  \n").problems).toEqual([{ line: 0, reason: "The file is empty." }]);
    expect(parseScheduleCsv(`${HEADER}\n\n`).problems).toEqual([{ line: 0, reason: "The file has a header but no rows." }]);
  });

  it("never throws on arbitrary input, and every problem has a line within the file", () => {
    const cell = fc.oneof(fc.string(), fc.constantFrom('"', '""', ",", ";", "\n", "\r\n", "\r", "\uFEFF", "2027-03-01 20:00", "UTC"));
    const line = fc.array(cell, { maxLength: 12 }).map((cells) => cells.join(","));
    const file = fc.oneof(
      fc.string({ maxLength: 400 }),
      fc.array(line, { maxLength: 20 }).map((lines) => [HEADER, ...lines].join("\n")),
    );
    fc.assert(
      fc.property(file, (text) => {
        const result = parseScheduleCsv(text);
        const lines = text.split(/\r\n|\n|\r/).length;
        for (const p of [...result.problems, ...result.rows]) {
          expect(p.line).toBeGreaterThanOrEqual(0);
          expect(p.line).toBeLessThanOrEqual(lines);
        }
        expect(result.rows.length + result.problems.length).toBeGreaterThan(0);
      }),
      { numRuns: 400 },
    );
  });
});
