import { KindBadge } from "@/components/schedule/kind-badge";
import { TimeRange } from "@/components/time/time-range";
import type { ImportPreviewRow } from "@/lib/schedule/import/view";

// A semester is a few thousand rows: show the start of the list, and say how many remain.
const SHOWN = 300;

export function ImportPreview({ rows }: { rows: ImportPreviewRow[] }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm" aria-label="Blocks to be created">
        <thead className="text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th className="py-1 pr-3 font-medium">Line</th>
            <th className="py-1 pr-3 font-medium">When</th>
            <th className="py-1 pr-3 font-medium">Telescope</th>
            <th className="py-1 pr-3 font-medium">Program</th>
            <th className="py-1 pr-3 font-medium">Observer</th>
            <th className="py-1 pr-3 font-medium">Instrument</th>
            <th className="py-1 font-medium">Kind</th>
          </tr>
        </thead>
        <tbody>
          {rows.slice(0, SHOWN).map((r) => (
            <tr key={r.line} className="border-t border-line align-top">
              <td className="num py-1.5 pr-3 text-muted">{r.line}</td>
              <td className="py-1.5 pr-3"><TimeRange start={new Date(r.startsAt)} end={new Date(r.endsAt)} timeZone={r.timeZone} /></td>
              <td className="num py-1.5 pr-3">{r.telescope}</td>
              <td className="py-1.5 pr-3"><span className="num">{r.program}</span> <span className="text-muted">{r.programTitle}</span></td>
              <td className="py-1.5 pr-3">{r.observer ?? <span className="text-muted">—</span>}</td>
              <td className="num py-1.5 pr-3">{r.instrument ?? <span className="text-muted">—</span>}</td>
              <td className="py-1.5"><KindBadge kind={r.kind} /></td>
            </tr>
          ))}
        </tbody>
      </table>
      {rows.length > SHOWN && <p className="mt-2 text-xs text-muted">…and {rows.length - SHOWN} more blocks.</p>}
    </div>
  );
}
