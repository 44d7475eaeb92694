import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { checkImportFile, commitImport, ImportRejectedError, importFile } from "@/lib/schedule/import/service";
import { parseScheduleCsv } from "@/lib/schedule/import/csv";
import { makeUser } from "../fixtures";
import { blocksOn, importAudits, makeImportWorld, type ImportWorld } from "./world";

const HEADER = "telescope,program,observer_email,instrument,kind,start,end,time_zone,notes";

function validCsv(w: ImportWorld): string {
  return [
    HEADER,
    `${w.telescope.code},${w.science.code},${w.observer.email},${w.instrument.code},,2027-02-01 21:00,2027-02-02 01:00,America/Santiago,first half`,
    `${w.telescope.code},${w.engineering.code},,,,2027-02-02T04:00:00Z,2027-02-02T09:00:00Z,,`,
    `${w.telescope.code},${w.science.code},,,too,2027-02-02T09:00:00Z,2027-02-02T10:00:00Z,,"a note, with a comma"`,
  ].join("\n");
}

async function rejection(work: Promise<unknown>): Promise<ImportRejectedError> {
  const error = await work.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(ImportRejectedError);
  return error as ImportRejectedError;
}

describe("importing a schedule CSV", () => {
  it("dry-runs, then creates every block in one transaction with one audit entry", async () => {
    const w = await makeImportWorld();
    const admin = await makeUser(["admin"]);
    const checked = await checkImportFile(getDb(), "semester.csv", validCsv(w));
    expect(checked.problems).toEqual([]);
    expect(checked.toCreate).toHaveLength(3);
    expect(await blocksOn(w.telescope.id)).toEqual([]); // the check wrote nothing

    const result = await importFile(getDb(), admin.id, "semester.csv", validCsv(w));
    expect(result.created).toBe(3);
    const blocks = await blocksOn(w.telescope.id);
    expect(blocks.map((b) => [b.starts_at.toISOString(), b.ends_at.toISOString(), b.kind, b.notes])).toEqual([
      // 21:00 in Santiago in February (summer time, UTC−3) is 00:00 UT the next day.
      ["2027-02-02T00:00:00.000Z", "2027-02-02T04:00:00.000Z", "science", "first half"],
      ["2027-02-02T04:00:00.000Z", "2027-02-02T09:00:00.000Z", "engineering", ""],
      ["2027-02-02T09:00:00.000Z", "2027-02-02T10:00:00.000Z", "too", "a note, with a comma"],
    ]);
    expect(blocks[0]).toMatchObject({ observer_user_id: w.observer.id, instrument_id: w.instrument.id, program_id: w.science.id });
    const audits = await importAudits(admin.id);
    expect(audits).toHaveLength(1);
    expect(audits[0]?.details).toMatchObject({ fileName: "semester.csv", format: "csv", created: 3, telescopes: [w.telescope.code] });
  });

  it("reports every bad row by line and reason, and commits nothing", async () => {
    const w = await makeImportWorld();
    const admin = await makeUser(["admin"]);
    await getDb()
      .insertInto("blocks")
      .values({ telescope_id: w.telescope.id, program_id: w.science.id, kind: "science", starts_at: new Date("2027-03-10T00:00:00Z"), ends_at: new Date("2027-03-10T04:00:00Z") })
      .execute();
    const t = w.telescope.code;
    const text = [
      HEADER,
      `${t},${w.science.code},,,,2027-03-01T00:00:00Z,2027-03-01T04:00:00Z,,good row`,
      `${t},NO-SUCH-PROGRAM,,,,2027-03-02T00:00:00Z,2027-03-02T04:00:00Z,,`,
      `${t},${w.science.code},,,,31/03/2027 22:00,2027-03-03T04:00:00Z,,`,
      `${t},${w.science.code},,,,2027-03-10T03:00:00Z,2027-03-10T05:00:00Z,,`,
      `${t},${w.science.code},,,,2027-03-12T00:00:00Z,2027-03-12T04:00:00Z,,`,
      `${t},${w.engineering.code},,,,2027-03-12T03:30:00Z,2027-03-12T06:00:00Z,,`,
      `${t},${w.science.code},,,,2027-03-14 21:00,2027-03-15 03:00,,`,
    ].join("\n");

    const checked = await checkImportFile(getDb(), "bad.csv", text);
    expect(checked.problems).toEqual([
      { line: 3, reason: 'Unknown program "NO-SUCH-PROGRAM".' },
      { line: 4, reason: expect.stringMatching(/^Bad time in start: "31\/03\/2027 22:00"/) },
      { line: 5, reason: `Overlaps the existing ${w.science.code} block on ${t}, 2027-03-10 00:00–04:00 UT.` },
      { line: 7, reason: `Overlaps line 6 of this file on ${t} (2027-03-12 00:00–04:00 UT).` },
      { line: 8, reason: expect.stringMatching(/^Time zone missing: start "2027-03-14 21:00" has no offset/) },
    ]);
    expect(checked.toCreate.map((b) => b.line)).toEqual([2, 6]);

    const error = await rejection(importFile(getDb(), admin.id, "bad.csv", text));
    expect(error.problems).toEqual(checked.problems);
    expect(await blocksOn(w.telescope.id)).toHaveLength(1); // only the block that was there before
    expect(await importAudits(admin.id)).toEqual([]);
  });

  it("refuses a whole file when one row is unreadable, even if the rest is fine", async () => {
    const w = await makeImportWorld();
    const admin = await makeUser(["admin"]);
    const text = `${validCsv(w)}\n${w.telescope.code},${w.science.code},,,,2027-02-05T00:00:00Z,2027-02-05T01:00:00Z,,"unterminated\n`;
    const error = await rejection(importFile(getDb(), admin.id, "semester.csv", text));
    expect(error.problems).toEqual([{ line: 5, reason: expect.stringMatching(/never closed/) }]);
    expect(await blocksOn(w.telescope.id)).toEqual([]);
  });

  it("refuses the whole import when the schedule changed after the dry run", async () => {
    const w = await makeImportWorld();
    const admin = await makeUser(["admin"]);
    const { rows } = parseScheduleCsv(validCsv(w));
    // Someone books the telescope between "Check file" and "Import".
    await getDb()
      .insertInto("blocks")
      .values({ telescope_id: w.telescope.id, program_id: w.science.id, kind: "science", starts_at: new Date("2027-02-02T09:30:00Z"), ends_at: new Date("2027-02-02T11:00:00Z") })
      .execute();
    const error = await rejection(commitImport(getDb(), admin.id, rows));
    expect(error.problems).toEqual([{ line: 4, reason: expect.stringMatching(/^Overlaps the existing/) }]);
    expect(await blocksOn(w.telescope.id)).toHaveLength(1);
  });
});

describe("importing local wall-clock times across a DST change", () => {
  // Source: EU Directive 2000/84/EC — summer time begins at 01:00 UTC on the last Sunday of
  // March (28 March 2027): Madrid goes from UTC+1 to UTC+2 at 02:00 local.
  it("gives a Madrid night spanning the March change the right UTC instants", async () => {
    const w = await makeImportWorld("Europe/Madrid");
    const admin = await makeUser(["admin"]);
    const text = [HEADER, `${w.telescope.code},${w.science.code},,,,2027-03-27 21:00,2027-03-28 06:30,Europe/Madrid,across the change`].join("\n");
    await importFile(getDb(), admin.id, "madrid.csv", text);
    const [block] = await blocksOn(w.telescope.id);
    expect(block?.starts_at.toISOString()).toBe("2027-03-27T20:00:00.000Z");
    expect(block?.ends_at.toISOString()).toBe("2027-03-28T04:30:00.000Z"); // 9.5 h on the wall clock, 8.5 h of night
  });

  // Source: IANA tz database, `southamerica`, Rule Chile — standard time resumes on the first
  // Sunday on or after 2 April at 03:00 UTC (4 April 2027): Santiago goes from UTC−3 to UTC−4.
  it("gives a Santiago night spanning the April change the right UTC instants, and refuses the repeated hour", async () => {
    const w = await makeImportWorld("America/Santiago");
    const admin = await makeUser(["admin"]);
    const ok = [HEADER, `${w.telescope.code},${w.science.code},,,,2027-04-03 20:00,2027-04-04 05:00,America/Santiago,`].join("\n");
    await importFile(getDb(), admin.id, "santiago.csv", ok);
    const [block] = await blocksOn(w.telescope.id);
    expect(block?.starts_at.toISOString()).toBe("2027-04-03T23:00:00.000Z");
    expect(block?.ends_at.toISOString()).toBe("2027-04-04T09:00:00.000Z");

    const repeated = [HEADER, `${w.telescope.code},${w.engineering.code},,,,2027-04-10 20:00,2027-04-03 23:30,America/Santiago,`].join("\n");
    const checked = await checkImportFile(getDb(), "santiago.csv", repeated);
    expect(checked.problems).toEqual([
      { line: 2, reason: "end 2027-04-03 23:30 happens twice in America/Santiago: the clocks go back that night. Give the time with its offset: 2027-04-03T23:30-03:00 or 2027-04-03T23:30-04:00." },
    ]);
  });
});

describe("importing an iCalendar file", () => {
  it("creates blocks from events with TZID and UTC times, and reports bad events by line", async () => {
    const w = await makeImportWorld("Europe/Madrid");
    const admin = await makeUser(["admin"]);
    const event = (lines: string[]) => ["BEGIN:VEVENT", ...lines, "END:VEVENT"];
    const calendar = (events: string[][]) => ["BEGIN:VCALENDAR", "VERSION:2.0", "PRODID:-//test//EN", ...events.flat(), "END:VCALENDAR"].join("\r\n");
    const good = [
      event([
        "UID:one",
        "DTSTART;TZID=Europe/Madrid:20270327T210000",
        "DTEND;TZID=Europe/Madrid:20270328T063000",
        `X-NIGHTBREAK-TELESCOPE:${w.telescope.code}`,
        `X-NIGHTBREAK-PROGRAM:${w.science.code}`,
        `X-NIGHTBREAK-OBSERVER:${w.observer.email}`,
        `X-NIGHTBREAK-INSTRUMENT:${w.instrument.code}`,
      ]),
      event(["UID:two", "DTSTART:20270329T200000Z", "DTEND:20270330T040000Z", `SUMMARY:${w.engineering.code} maintenance`, `LOCATION:${w.telescope.code} dome`]),
    ];
    const bad = [
      event(["UID:three", "DTSTART:20270401T200000Z", "DTEND:20270402T040000Z", `X-NIGHTBREAK-TELESCOPE:${w.telescope.code}`, "X-NIGHTBREAK-PROGRAM:NOPE"]),
      event(["UID:four", "DTSTART:20270403T200000", "DTEND:20270404T040000", `X-NIGHTBREAK-TELESCOPE:${w.telescope.code}`, `X-NIGHTBREAK-PROGRAM:${w.science.code}`]),
    ];

    const rejected = await rejection(importFile(getDb(), admin.id, "mixed.ics", calendar([...good, ...bad])));
    expect(rejected.problems).toEqual([
      { line: 20, reason: 'Unknown program "NOPE".' },
      { line: 27, reason: expect.stringMatching(/^Time zone missing: DTSTART "2027-04-03T20:00:00" has no offset, so TZID/) },
    ]);
    expect(await blocksOn(w.telescope.id)).toEqual([]);

    const result = await importFile(getDb(), admin.id, "good.ics", calendar(good));
    expect(result.created).toBe(2);
    const blocks = await blocksOn(w.telescope.id);
    expect(blocks.map((b) => [b.starts_at.toISOString(), b.ends_at.toISOString(), b.kind])).toEqual([
      ["2027-03-27T20:00:00.000Z", "2027-03-28T04:30:00.000Z", "science"],
      ["2027-03-29T20:00:00.000Z", "2027-03-30T04:00:00.000Z", "engineering"],
    ]);
    expect(blocks[0]).toMatchObject({ observer_user_id: w.observer.id, instrument_id: w.instrument.id });
    expect((await importAudits(admin.id))[0]?.details).toMatchObject({ fileName: "good.ics", format: "ical", created: 2 });
  });
});
