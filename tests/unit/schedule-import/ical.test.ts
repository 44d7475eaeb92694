import { describe, expect, it } from "vitest";
import { parseScheduleIcal } from "@/lib/schedule/import/ical";
import { detectFormat } from "@/lib/schedule/import/parse";

const calendar = (...lines: string[]) => ["BEGIN:VCALENDAR", "VERSION:2.0", "PRODID:-//test//EN", ...lines, "END:VCALENDAR"].join("\r\n");

describe("the schedule iCalendar reader", () => {
  it("reads our X- properties, TZID and UTC times, with the BEGIN:VEVENT line", () => {
    const text = calendar(
      "BEGIN:VEVENT",
      "UID:a",
      "DTSTART;TZID=Europe/Madrid:20270328T010000",
      "DTEND;TZID=Europe/Madrid:20270328T060000",
      "SUMMARY:whatever",
      "X-NIGHTBREAK-TELESCOPE:SO-18",
      "X-NIGHTBREAK-PROGRAM:P-07",
      "X-NIGHTBREAK-KIND:payback",
      "X-NIGHTBREAK-OBSERVER:ana@example.test",
      "X-NIGHTBREAK-INSTRUMENT:SPEC",
      "X-NIGHTBREAK-NOTES:bring the filter\\, please",
      "END:VEVENT",
      "BEGIN:VEVENT",
      "UID:b",
      "DTSTART:20270329T230000Z",
      "DTEND:20270330T050000Z",
      "SUMMARY:P-08 observing",
      "LOCATION:AQ-24 — Alto 2.4 m",
      "CATEGORIES:Night,ENGINEERING",
      "ATTENDEE;CN=Bo:mailto:bo@example.test",
      "END:VEVENT",
    );
    const { rows, problems, format } = parseScheduleIcal(text);
    expect(format).toBe("ical");
    expect(problems).toEqual([]);
    expect(rows).toEqual([
      { line: 4, format: "ical", telescope: "SO-18", program: "P-07", observerEmail: "ana@example.test", instrument: "SPEC", kind: "payback", start: "2027-03-28T01:00:00", end: "2027-03-28T06:00:00", timeZone: "Europe/Madrid", notes: "bring the filter, please" },
      { line: 16, format: "ical", telescope: "AQ-24", program: "P-08", observerEmail: "bo@example.test", instrument: "", kind: "engineering", start: "2027-03-29T23:00:00Z", end: "2027-03-30T05:00:00Z", timeZone: "", notes: "" },
    ]);
  });

  it("reads floating times in the calendar's X-WR-TIMEZONE, and leaves the zone empty without it", () => {
    const event = ["BEGIN:VEVENT", "DTSTART:20270301T200000", "DTEND:20270302T020000", "SUMMARY:P-01", "LOCATION:AQ-24", "END:VEVENT"];
    expect(parseScheduleIcal(calendar("X-WR-TIMEZONE:America/Santiago", ...event)).rows[0]?.timeZone).toBe("America/Santiago");
    expect(parseScheduleIcal(calendar(...event)).rows[0]?.timeZone).toBe("");
  });

  it("reports events it will not import, each at its own line", () => {
    const text = calendar(
      "BEGIN:VEVENT",
      "DTSTART;VALUE=DATE:20270301",
      "SUMMARY:P-01",
      "END:VEVENT",
      "BEGIN:VEVENT",
      "DTSTART:20270301T200000Z",
      "DURATION:PT6H",
      "END:VEVENT",
      "BEGIN:VEVENT",
      "DTSTART:20270301T200000Z",
      "DTEND:20270301T230000Z",
      "RRULE:FREQ=DAILY;COUNT=3",
      "END:VEVENT",
      "BEGIN:VEVENT",
      "DTSTART:nonsense",
      "DTEND:20270301T230000Z",
      "END:VEVENT",
      "BEGIN:VEVENT",
      "DTSTART;TZID=Europe/Madrid:20270301T200000",
      "DTEND;TZID=Atlantic/Canary:20270301T230000",
      "END:VEVENT",
    );
    const { rows, problems } = parseScheduleIcal(text);
    expect(rows).toEqual([]);
    expect(problems.map((p) => p.line)).toEqual([4, 8, 12, 17, 21]);
    expect(problems.map((p) => p.reason)).toEqual([
      expect.stringMatching(/all-day/),
      expect.stringMatching(/DURATION/),
      expect.stringMatching(/Repeating/),
      expect.stringMatching(/DTSTART is not a date-time/),
      expect.stringMatching(/different zones/),
    ]);
  });

  it("points at the offending line of an unreadable file", () => {
    const { problems } = parseScheduleIcal("BEGIN:VCALENDAR\nVERSION:2.0\nthis line is broken\nEND:VCALENDAR\n");
    expect(problems).toEqual([{ line: 3, reason: expect.stringMatching(/not a readable iCalendar file/) }]);
    expect(parseScheduleIcal("BEGIN:VCALENDAR\nVERSION:2.0\nEND:VCALENDAR\n").problems[0]?.reason).toMatch(/no events/);
  });

  it("is told apart from CSV by its content first, its name second", () => {
    expect(detectFormat("semester.csv", "BEGIN:VCALENDAR\r\n")).toBe("ical");
    expect(detectFormat("semester.ics", "telescope,program\n")).toBe("ical");
    expect(detectFormat("pasted text", "telescope,program\n")).toBe("csv");
  });
});
