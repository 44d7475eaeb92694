import { describe, expect, it } from "vitest";
import { instrumentKey, planRows, type ExistingBlock, type ImportCatalog } from "@/lib/schedule/import/plan-rows";
import type { ImportRow } from "@/lib/schedule/import/types";

const catalog: ImportCatalog = {
  telescopes: new Map([
    ["aq-24", { id: "t1", code: "AQ-24", name: "Alto 2.4 m", timeZone: "America/Santiago" }],
    ["so-18", { id: "t2", code: "SO-18", name: "Orla 1.8 m", timeZone: "Europe/Madrid" }],
  ]),
  programs: new Map([
    ["p-01", { id: "p1", code: "P-01", title: "Comets", category: "science" }],
    ["eng", { id: "p2", code: "ENG", title: "Engineering", category: "engineering" }],
  ]),
  users: new Map([
    ["ana@example.test", { id: "u1", name: "Ana", email: "ana@example.test", disabled: false }],
    ["gone@example.test", { id: "u2", name: "Gone", email: "gone@example.test", disabled: true }],
  ]),
  instruments: new Map([[instrumentKey("t1", "CAM"), { id: "i1", code: "CAM", telescopeId: "t1" }]]),
};

let nextLine = 2;
const row = (over: Partial<ImportRow>): ImportRow => ({
  line: nextLine++,
  format: "csv",
  telescope: "AQ-24",
  program: "P-01",
  observerEmail: "",
  instrument: "",
  kind: "",
  start: "2027-03-01T23:00:00Z",
  end: "2027-03-02T03:00:00Z",
  timeZone: "",
  notes: "",
  ...over,
});

describe("planning an import", () => {
  it("resolves codes whatever their case and defaults the kind to the program's category", () => {
    const plan = planRows([row({ line: 2, telescope: "aq-24", program: "eng", observerEmail: "ANA@example.test", instrument: "cam" })], catalog, []);
    expect(plan.problems).toEqual([]);
    expect(plan.toCreate).toEqual([
      {
        line: 2,
        telescope: { id: "t1", code: "AQ-24", name: "Alto 2.4 m", timeZone: "America/Santiago" },
        program: { id: "p2", code: "ENG", title: "Engineering" },
        observer: { id: "u1", name: "Ana", email: "ana@example.test" },
        instrument: { id: "i1", code: "CAM" },
        kind: "engineering",
        startsAt: new Date("2027-03-01T23:00:00Z"),
        endsAt: new Date("2027-03-02T03:00:00Z"),
        notes: "",
      },
    ]);
  });

  it("reports every problem of every row by line", () => {
    const plan = planRows(
      [
        row({ line: 2, program: "P-99", telescope: "XX-1" }),
        row({ line: 3, observerEmail: "nobody@example.test", instrument: "SPEC", kind: "lunch" }),
        row({ line: 4, observerEmail: "gone@example.test", start: "soon" }),
        row({ line: 5, start: "2027-03-02T03:00:00Z", end: "2027-03-01T23:00:00Z" }),
        row({ line: 6, start: "2027-03-05 20:00", end: "2027-03-06 02:00" }),
        row({ line: 7, start: "2027-03-05 20:00", end: "2027-03-06 02:00", timeZone: "Chile/Nowhere" }),
        row({ line: 8, telescope: "", program: "" }),
      ],
      catalog,
      [],
    );
    expect(plan.toCreate).toEqual([]);
    expect(plan.problems).toEqual([
      { line: 2, reason: 'Unknown telescope "XX-1".' },
      { line: 2, reason: 'Unknown program "P-99".' },
      { line: 3, reason: 'Unknown observer "nobody@example.test": no user has that e-mail.' },
      { line: 3, reason: 'The instrument "SPEC" is not mounted on AQ-24.' },
      { line: 3, reason: expect.stringMatching(/^Unknown kind "lunch": use science, engineering/) },
      { line: 4, reason: "The observer gone@example.test is disabled." },
      { line: 4, reason: expect.stringMatching(/^Bad time in start: "soon"/) },
      { line: 5, reason: "The end (2027-03-01 23:00 UT) must come after the start (2027-03-02 03:00 UT)." },
      { line: 6, reason: expect.stringMatching(/^Time zone missing: start "2027-03-05 20:00" has no offset, so time_zone must name/) },
      { line: 7, reason: expect.stringMatching(/^Unknown time zone "Chile\/Nowhere"/) },
      { line: 8, reason: "The telescope is missing." },
      { line: 8, reason: "The program is missing." },
    ]);
  });

  it("finds overlaps with existing blocks and between rows, on the same telescope only", () => {
    const existing: ExistingBlock[] = [
      { telescopeId: "t1", programCode: "OLD-1", startsAt: new Date("2027-03-10T00:00:00Z"), endsAt: new Date("2027-03-10T04:00:00Z") },
      { telescopeId: "t1", programCode: "OLD-2", startsAt: new Date("2027-03-10T04:00:00Z"), endsAt: new Date("2027-03-10T08:00:00Z") },
    ];
    const plan = planRows(
      [
        row({ line: 2, start: "2027-03-10T03:00:00Z", end: "2027-03-10T05:00:00Z" }),
        row({ line: 3, start: "2027-03-10T08:00:00Z", end: "2027-03-10T09:00:00Z" }),
        row({ line: 4, start: "2027-03-12T00:00:00Z", end: "2027-03-12T06:00:00Z" }),
        row({ line: 5, start: "2027-03-12T05:00:00Z", end: "2027-03-12T07:00:00Z" }),
        row({ line: 6, telescope: "SO-18", start: "2027-03-12T00:00:00Z", end: "2027-03-12T06:00:00Z" }),
      ],
      catalog,
      existing,
    );
    expect(plan.problems).toEqual([
      { line: 2, reason: "Overlaps the existing OLD-1 block on AQ-24, 2027-03-10 00:00–04:00 UT and 1 more." },
      { line: 5, reason: "Overlaps line 4 of this file on AQ-24 (2027-03-12 00:00–06:00 UT)." },
    ]);
    expect(plan.toCreate.map((b) => b.line)).toEqual([3, 4, 6]);
  });

  it("words time problems of an iCalendar row in its own terms", () => {
    const plan = planRows([row({ line: 9, format: "ical", start: "2027-10-31T02:30:00", end: "2027-10-31T06:00:00", timeZone: "Europe/Madrid", telescope: "SO-18" })], catalog, []);
    expect(plan.problems).toEqual([
      { line: 9, reason: "DTSTART 2027-10-31T02:30:00 happens twice in Europe/Madrid: the clocks go back that night. Give the time with its offset: 2027-10-31T02:30:00+02:00 or 2027-10-31T02:30:00+01:00." },
    ]);
  });
});
