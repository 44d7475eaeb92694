import { IMPORT_COLUMNS, REQUIRED_COLUMNS } from "@/lib/schedule/import/columns";

const MEANING: Record<(typeof IMPORT_COLUMNS)[number], string> = {
  telescope: "Telescope code.",
  program: "Program code.",
  observer_email: "E-mail of the observer scheduled on the block.",
  instrument: "Instrument code, mounted on that telescope.",
  kind: "science, engineering, discretionary, too (or override), payback. Empty: the program's category.",
  start: "2027-03-01T23:00:00Z, 2027-03-01T20:00-03:00, or local 2027-03-01 20:00 with time_zone.",
  end: "As start.",
  time_zone: "IANA zone for local times, e.g. America/Santiago. Needed when a time has no offset.",
  notes: "Free text, up to 2000 characters.",
};

const ICAL: Array<[string, string]> = [
  ["telescope", "X-NIGHTBREAK-TELESCOPE, else the first word of LOCATION"],
  ["program", "X-NIGHTBREAK-PROGRAM, else the first word of SUMMARY"],
  ["kind", "X-NIGHTBREAK-KIND, else a CATEGORIES value that is a block kind"],
  ["observer", "X-NIGHTBREAK-OBSERVER (e-mail), else the first ATTENDEE mailto: address"],
  ["instrument, notes", "X-NIGHTBREAK-INSTRUMENT, X-NIGHTBREAK-NOTES"],
  ["start, end", "DTSTART and DTEND in UTC (…Z), with TZID=<IANA zone>, or floating in the calendar's X-WR-TIMEZONE"],
];

export function ImportFormatHelp() {
  return (
    <details className="mt-8 rounded-lg border border-line bg-raised p-4 text-sm">
      <summary className="cursor-pointer font-semibold">File formats</summary>
      <h3 className="mt-3 mb-1 font-semibold">CSV columns</h3>
      <p className="mb-2 text-muted">The first line names the columns (any order). A schedule exported from Nightbreak imports as it is.</p>
      <table className="w-full text-left">
        <tbody>
          {IMPORT_COLUMNS.map((c) => (
            <tr key={c} className="border-t border-line align-top">
              <td className="num py-1 pr-3 whitespace-nowrap">{c}{REQUIRED_COLUMNS.includes(c) && <span className="text-danger"> *</span>}</td>
              <td className="py-1">{MEANING[c]}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <h3 className="mt-4 mb-1 font-semibold">iCalendar events</h3>
      <table className="w-full text-left">
        <tbody>
          {ICAL.map(([field, source]) => (
            <tr key={field} className="border-t border-line align-top">
              <td className="py-1 pr-3 whitespace-nowrap">{field}</td>
              <td className="num py-1 text-xs">{source}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-muted">
        A local time that the clocks skip or repeat at a daylight-saving change is refused: give it with an offset. All-day,
        repeating and cancelled events are reported, not imported.
      </p>
    </details>
  );
}
