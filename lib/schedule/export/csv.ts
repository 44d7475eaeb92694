/**
 * The schedule as CSV, in the import's own columns (lib/schedule/import/columns.ts) so an
 * export imports again unchanged. Times are the site's wall clock with its UTC offset
 * ("2027-03-28T03:00:00+02:00"): readable at the site, and exact whatever the DST rules.
 */
import Papa from "papaparse";
import { IMPORT_COLUMNS, type ImportColumn } from "@/lib/schedule/import/columns";
import { formatZonedIso } from "@/lib/schedule/import/zoned-time";
import type { ExportBlock } from "./queries";

function toRecord(b: ExportBlock): Record<ImportColumn, string> {
  return {
    telescope: b.telescope.code,
    program: b.program.code,
    observer_email: b.observer?.email ?? "",
    instrument: b.instrument?.code ?? "",
    kind: b.kind,
    start: formatZonedIso(b.startsAt, b.site.timeZone),
    end: formatZonedIso(b.endsAt, b.site.timeZone),
    time_zone: b.site.timeZone,
    notes: b.notes,
  };
}

export function blocksToCsv(blocks: ExportBlock[]): string {
  // escapeFormulae: a note such as "=HYPERLINK(…)" must stay text when opened in a spreadsheet.
  return Papa.unparse({ fields: [...IMPORT_COLUMNS], data: blocks.map((b) => IMPORT_COLUMNS.map((c) => toRecord(b)[c])) }, { escapeFormulae: true, newline: "\r\n" });
}
