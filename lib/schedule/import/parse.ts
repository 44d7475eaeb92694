import { parseScheduleCsv } from "./csv";
import { parseScheduleIcal } from "./ical";
import type { ImportFormat, ParsedFile } from "./types";

/** The content decides (a calendar starts with BEGIN:VCALENDAR); the name only when in doubt. */
export function detectFormat(fileName: string, text: string): ImportFormat {
  if (/^\uFEFF?\s*BEGIN:(VCALENDAR|VEVENT)\b/i.test(text)) return "ical";
  return /\.(ics|ical|ifb)$/i.test(fileName.trim()) ? "ical" : "csv";
}

export function parseScheduleFile(fileName: string, text: string): ParsedFile {
  return detectFormat(fileName, text) === "ical" ? parseScheduleIcal(text) : parseScheduleCsv(text);
}
