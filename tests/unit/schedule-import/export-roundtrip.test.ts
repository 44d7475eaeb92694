import ICAL from "ical.js";
import { describe, expect, it } from "vitest";
import { blocksToCsv } from "@/lib/schedule/export/csv";
import { blocksToIcal } from "@/lib/schedule/export/ical";
import type { ExportBlock } from "@/lib/schedule/export/queries";
import { parseScheduleCsv } from "@/lib/schedule/import/csv";
import { parseScheduleIcal } from "@/lib/schedule/import/ical";
import { parseImportTime } from "@/lib/schedule/import/times";

const block = (over: Partial<ExportBlock>): ExportBlock => ({
  id: "6f1c0b7e-0000-4000-8000-000000000001",
  kind: "science",
  startsAt: new Date("2027-03-27T23:30:00Z"),
  endsAt: new Date("2027-03-28T05:30:00Z"),
  updatedAt: new Date("2027-01-01T00:00:00Z"),
  notes: "",
  telescope: { code: "SO-18", name: "Orla 1.8 m" },
  site: { name: "Sierra Orla", timeZone: "Europe/Madrid" },
  program: { code: "P-07", title: "Young supernovae" },
  pi: { name: "Pat Iglesias", email: "pat@example.test" },
  observer: { name: "Ana", email: "ana@example.test" },
  instrument: { code: "SPEC", name: "Spectrograph" },
  ...over,
});

const blocks = [
  block({}),
  block({ id: "6f1c0b7e-0000-4000-8000-000000000002", kind: "too", notes: '=cmd, "quoted"; \\ and\na second line', observer: null, instrument: null, startsAt: new Date("2027-04-03T23:00:00Z"), endsAt: new Date("2027-04-04T06:00:00Z"), telescope: { code: "AQ-24", name: "Alto 2.4 m" }, site: { name: "Alto Quebrada", timeZone: "America/Santiago" } }),
];

describe("export and re-import", () => {
  it("writes the CSV in the import's columns and reads it back to the same instants and fields", () => {
    const csv = blocksToCsv(blocks);
    expect(csv.split("\r\n")[0]).toBe("telescope,program,observer_email,instrument,kind,start,end,time_zone,notes");
    expect(csv).toContain("2027-03-28T00:30:00+01:00,2027-03-28T07:30:00+02:00,Europe/Madrid");
    const { rows, problems } = parseScheduleCsv(csv);
    expect(problems).toEqual([]);
    expect(rows.map((r) => [r.telescope, r.program, r.observerEmail, r.instrument, r.kind, r.notes])).toEqual([
      ["SO-18", "P-07", "ana@example.test", "SPEC", "science", ""],
      ["AQ-24", "P-07", "", "", "too", '=cmd, "quoted"; \\ and\na second line'],
    ]);
    const instants = rows.map((r) => [parseImportTime(r.start, r.timeZone), parseImportTime(r.end, r.timeZone)].map((t) => (t.ok ? t.instant.getTime() : NaN)));
    expect(instants).toEqual(blocks.map((b) => [b.startsAt.getTime(), b.endsAt.getTime()]));
  });

  it("writes iCalendar that ical.js reads back with identical UTC instants and our properties", () => {
    const text = blocksToIcal(blocks, { name: "Test" });
    const events = new ICAL.Component(ICAL.parse(text)).getAllSubcomponents("vevent").map((c) => new ICAL.Event(c));
    expect(events.map((e) => e.uid)).toEqual(blocks.map((b) => b.id));
    expect(events.map((e) => [e.startDate.toJSDate().getTime(), e.endDate.toJSDate().getTime()])).toEqual(blocks.map((b) => [b.startsAt.getTime(), b.endsAt.getTime()]));
    expect(events.map((e) => e.startDate.zone?.tzid)).toEqual(["UTC", "UTC"]);
    expect(events[0]?.summary).toBe("P-07 · science");
    expect(events[0]?.location).toBe("SO-18 — Orla 1.8 m, Sierra Orla");
    expect(events[0]?.description).toContain("PI: Pat Iglesias <pat@example.test>");
    expect(events[0]?.description).toContain("Observer: Ana <ana@example.test>");
    expect(events[0]?.description).toContain("Instrument: SPEC — Spectrograph");

    const { rows, problems } = parseScheduleIcal(text);
    expect(problems).toEqual([]);
    expect(rows.map((r) => [r.telescope, r.program, r.observerEmail, r.instrument, r.kind, r.notes, r.start, r.end])).toEqual([
      ["SO-18", "P-07", "ana@example.test", "SPEC", "science", "", "2027-03-27T23:30:00Z", "2027-03-28T05:30:00Z"],
      ["AQ-24", "P-07", "", "", "too", '=cmd, "quoted"; \\ and\na second line', "2027-04-03T23:00:00Z", "2027-04-04T06:00:00Z"],
    ]);
  });
});
