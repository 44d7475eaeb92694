import { TimeRange } from "@/components/time/time-range";
import { cn } from "@/lib/cn";
import type { TelescopeFeasibility } from "@/lib/requests/feasibility/types";

const SUN_TEXT = { clear: "clear", restricted: "shortens windows", refused: "refused" } as const;

/** Every night of the request's window on one telescope: its windows (UT and site time), the Moon, sun avoidance. */
export function NightTable({ telescope }: { telescope: TelescopeFeasibility }) {
  return (
    <div className="scroll-cue overflow-x-auto rounded-md border border-line">
      <table className="w-full text-left text-xs">
        <caption className="sr-only">{`Observable windows on ${telescope.code}, night by night`}</caption>
        <thead className="bg-sunken text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th scope="col" className="px-1.5 py-1.5 font-medium">Night of</th>
            <th scope="col" className="px-1.5 py-1.5 font-medium">Observable windows</th>
            <th scope="col" className="px-1.5 py-1.5 text-right font-medium">Minutes</th>
            <th scope="col" className="px-1.5 py-1.5 text-right font-medium">Best airmass</th>
            <th scope="col" className="px-1.5 py-1.5 font-medium">Moon</th>
            <th scope="col" className="px-1.5 py-1.5 font-medium">Sun avoidance</th>
          </tr>
        </thead>
        <tbody>
          {telescope.nights.map((n) => (
            <tr key={n.nightOf} className="border-t border-line align-top">
              <td className="num px-1.5 py-1.5">{n.nightOf}</td>
              <td className="px-1.5 py-1.5">
                {n.windows.length === 0 ? (
                  <span className="text-muted">none</span>
                ) : (
                  n.windows.map((w) => <TimeRange key={w.start} start={new Date(w.start)} end={new Date(w.end)} timeZone={telescope.timeZone} />)
                )}
              </td>
              <td className="num px-1.5 py-1.5 text-right">{Math.floor(n.observableMinutes)}</td>
              <td className="num px-1.5 py-1.5 text-right">{n.bestAirmass === null ? "—" : n.bestAirmass.toFixed(2)}</td>
              {/* At most two lines, "40% lit," over "≥ 86° away", never a word to a line. */}
              <td className="num px-1.5 py-1.5">
                <span className="whitespace-nowrap">
                  {Math.round(n.moonIllumination * 100)}% lit{n.moonClosestDeg === null ? "" : ","}
                </span>
                {n.moonClosestDeg !== null && (
                  <>
                    {" "}
                    <span className="whitespace-nowrap">≥ {Math.round(n.moonClosestDeg)}° away</span>
                  </>
                )}
              </td>
              <td className={cn("px-1.5 py-1.5", n.sunAvoidance === "refused" && "font-semibold text-danger")} title={n.sunAvoidanceReason}>
                {SUN_TEXT[n.sunAvoidance]}
              </td>
            </tr>
          ))}
          {telescope.nights.length === 0 && (
            <tr>
              <td colSpan={6} className="px-2 py-3 text-center text-muted">
                No night of the window is left.
              </td>
            </tr>
          )}
        </tbody>
      </table>
    </div>
  );
}
