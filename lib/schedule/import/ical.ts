/**
 * Reads a schedule from an iCalendar file (parsed by ical.js) into ImportRows, one per
 * VEVENT. Our conventions, in order of preference:
 *
 * | block field | read from                                                                 |
 * |-------------|---------------------------------------------------------------------------|
 * | telescope   | X-NIGHTBREAK-TELESCOPE, else the first word of LOCATION                   |
 * | program     | X-NIGHTBREAK-PROGRAM, else the first word of SUMMARY                      |
 * | kind        | X-NIGHTBREAK-KIND, else the first CATEGORIES value that is a block kind   |
 * | observer    | X-NIGHTBREAK-OBSERVER (e-mail), else the first ATTENDEE mailto: address  |
 * | instrument  | X-NIGHTBREAK-INSTRUMENT                                                   |
 * | notes       | X-NIGHTBREAK-NOTES                                                        |
 * | start, end  | DTSTART and DTEND: UTC (…Z), or local with TZID=<IANA name>, or floating  |
 * |             | local times read in the calendar's X-WR-TIMEZONE                          |
 *
 * TZID must be an IANA zone name; VTIMEZONE definitions are not consulted (Intl knows the
 * real rules). Not imported, each reported against its event: all-day events, events
 * without DTEND (DURATION is not supported), repeating events (RRULE/RDATE) and cancelled
 * events. The line of a row is the line of its BEGIN:VEVENT.
 */
import ICAL from "ical.js";
import { BLOCK_KINDS } from "@/db/types";
import { MAX_IMPORT_ROWS, type ImportProblem, type ImportRow, type ParsedFile } from "./types";

type Component = InstanceType<typeof ICAL.Component>;
type JCal = ReturnType<typeof ICAL.parse>;

const DATE_TIME = /^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}:\d{2}(Z?)$/;

function text(event: Component, name: string): string {
  const value = event.getFirstPropertyValue(name);
  return typeof value === "string" ? value.trim() : "";
}

// ical.js leaves X- values as written; they carry TEXT escapes (\, \; \n \\) like SUMMARY.
function xText(event: Component, name: string): string {
  return text(event, name).replace(/\\([\\;,nN])/g, (_, c: string) => (c === "n" || c === "N" ? "\n" : c));
}

function firstWord(value: string): string {
  return value.split(/\s+/)[0] ?? "";
}

function categories(event: Component): string[] {
  return event.getAllProperties("categories").flatMap((p) => p.getValues().map((v) => String(v).trim()));
}

function attendeeEmail(event: Component): string {
  for (const p of event.getAllProperties("attendee")) {
    const value = String(p.getFirstValue() ?? "");
    if (/^mailto:/i.test(value)) return value.slice(7).trim();
  }
  return "";
}

interface TimeValue {
  value: string;
  tzid: string;
}

function timeOf(event: Component, name: "dtstart" | "dtend"): TimeValue | string {
  const label = name.toUpperCase();
  const prop = event.getFirstProperty(name);
  if (!prop) return name === "dtend" && event.getFirstProperty("duration") ? "DTEND is missing: give DTEND instead of DURATION." : `${label} is missing.`;
  if (prop.type === "date") return "An all-day event cannot be a block: give DTSTART and DTEND with times.";
  // The jCal value keeps the text as written ("2027-03-28T01:00:00" or "…Z"), which we
  // convert ourselves; ical.js's own zone handling needs VTIMEZONE definitions.
  const raw = (prop.jCal as unknown[])[3];
  if (typeof raw !== "string" || !DATE_TIME.test(raw)) return `${label} is not a date-time such as 20270328T010000Z.`;
  const tzid = prop.getParameter("tzid");
  return { value: raw, tzid: typeof tzid === "string" ? tzid.trim() : "" };
}

function roots(parsed: JCal): Component[] {
  if (!Array.isArray(parsed) || parsed.length === 0) return [];
  if (typeof parsed[0] === "string") return [new ICAL.Component(parsed)];
  return (parsed as unknown[]).filter(Array.isArray).map((j) => new ICAL.Component(j as unknown[]));
}

/** Every VEVENT in document order, each with the calendar it belongs to. */
function events(components: Component[], calendar?: Component): Array<{ event: Component; calendar?: Component }> {
  return components.flatMap((c) => {
    if (c.name === "vevent") return [{ event: c, calendar }];
    return events(c.getAllSubcomponents(), c.name === "vcalendar" ? c : calendar);
  });
}

function eventLines(source: string): number[] {
  const lines: number[] = [];
  source.split(/\r\n|\n|\r/).forEach((l, i) => {
    if (l.trim().toUpperCase() === "BEGIN:VEVENT") lines.push(i + 1);
  });
  return lines;
}

// ical.js quotes the offending line in its message; find it to point at the right line.
function errorLine(source: string, message: string): number {
  const quoted = /"([^"]*)"\s*$/.exec(message)?.[1];
  if (!quoted) return 0;
  const index = source.split(/\r\n|\n|\r/).findIndex((l) => l === quoted);
  return index < 0 ? 0 : index + 1;
}

function eventToRow(event: Component, calendar: Component | undefined, line: number): ImportRow | string {
  if (event.getFirstProperty("rrule") || event.getFirstProperty("rdate")) {
    return "Repeating events (RRULE/RDATE) are not imported: give each block as its own event.";
  }
  if (text(event, "status").toUpperCase() === "CANCELLED") return "This event is cancelled: remove it from the file.";
  const start = timeOf(event, "dtstart");
  if (typeof start === "string") return start;
  const end = timeOf(event, "dtend");
  if (typeof end === "string") return end;
  if (start.tzid && end.tzid && start.tzid !== end.tzid) return `DTSTART and DTEND name different zones (${start.tzid}, ${end.tzid}): use one.`;
  const calendarZone = calendar ? text(calendar, "x-wr-timezone") : "";
  const kinds = categories(event).map((c) => c.toLowerCase());
  return {
    line,
    format: "ical",
    telescope: xText(event, "x-nightbreak-telescope") || firstWord(text(event, "location")),
    program: xText(event, "x-nightbreak-program") || firstWord(text(event, "summary")),
    observerEmail: xText(event, "x-nightbreak-observer") || attendeeEmail(event),
    instrument: xText(event, "x-nightbreak-instrument"),
    kind: xText(event, "x-nightbreak-kind") || (kinds.find((k) => (BLOCK_KINDS as readonly string[]).includes(k)) ?? ""),
    start: start.value,
    end: end.value,
    timeZone: start.tzid || end.tzid || calendarZone,
    notes: xText(event, "x-nightbreak-notes"),
  };
}

export function parseScheduleIcal(source: string): ParsedFile {
  const rows: ImportRow[] = [];
  const problems: ImportProblem[] = [];
  const fail = (line: number, reason: string): ParsedFile => ({ format: "ical", rows: [], problems: [{ line, reason }] });
  if (!source.trim()) return fail(0, "The file is empty.");

  let found: Array<{ event: Component; calendar?: Component }>;
  try {
    found = events(roots(ICAL.parse(source.replace(/^\uFEFF/, ""))));
  } catch (error) {
    const message = error instanceof Error ? error.message : "unknown error";
    return fail(errorLine(source, message), `This is not a readable iCalendar file (${message}).`);
  }
  if (!found.length) return fail(0, "The calendar holds no events (VEVENT).");
  if (found.length > MAX_IMPORT_ROWS) return fail(0, `Too many events: a file may hold at most ${MAX_IMPORT_ROWS} blocks. Split it into several files.`);

  const lines = eventLines(source);
  found.forEach(({ event, calendar }, i) => {
    const line = lines[i] ?? 0;
    try {
      const row = eventToRow(event, calendar, line);
      if (typeof row === "string") problems.push({ line, reason: row });
      else rows.push(row);
    } catch (error) {
      problems.push({ line, reason: `This event could not be read (${error instanceof Error ? error.message : "unknown error"}).` });
    }
  });
  return { format: "ical", rows, problems };
}
