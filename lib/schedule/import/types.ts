/**
 * The shape both importers (CSV and iCalendar) produce and the planner consumes. Every value
 * is the trimmed text from the file ("" when absent): the planner alone decides what is
 * valid, so both formats get the same checks and the same messages.
 */
import type { BlockKind } from "@/db/types";

export type ImportFormat = "csv" | "ical";

export interface ImportRow {
  /** 1-based line in the file: the CSV record's first line, or the event's BEGIN:VEVENT. */
  line: number;
  format: ImportFormat;
  telescope: string;
  program: string;
  observerEmail: string;
  instrument: string;
  kind: string;
  /** ISO 8601 with an offset or Z, or a local wall-clock time read in `timeZone`. */
  start: string;
  end: string;
  timeZone: string;
  notes: string;
}

/** `line` 0 means the file as a whole (empty, unreadable). */
export interface ImportProblem {
  line: number;
  reason: string;
}

export interface ParsedFile {
  format: ImportFormat;
  rows: ImportRow[];
  problems: ImportProblem[];
}

export interface PlannedBlock {
  line: number;
  telescope: { id: string; code: string; name: string; timeZone: string };
  program: { id: string; code: string; title: string };
  observer: { id: string; name: string; email: string } | null;
  instrument: { id: string; code: string } | null;
  kind: BlockKind;
  startsAt: Date;
  endsAt: Date;
  notes: string;
}

export interface ImportPlan {
  toCreate: PlannedBlock[];
  problems: ImportProblem[];
}

/** Files are read whole in memory and sent through a server action, whose body limit is 1 MB. */
export const MAX_IMPORT_BYTES = 1_000_000;
export const MAX_IMPORT_ROWS = 5_000;
export const MAX_NOTES_LENGTH = 2_000;

export function byLine(a: ImportProblem, b: ImportProblem): number {
  return a.line - b.line;
}
