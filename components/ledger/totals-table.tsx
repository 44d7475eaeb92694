import type { Balance } from "@/lib/ledger/balances";
import { formatDuration } from "@/lib/time/format";

const cell = (v: number) => (v === 0 ? "—" : formatDuration(v));

/** Partner or semester lines: sums of their programs' lines. */
export function TotalsTable({ caption, rows, total }: { caption: string; rows: Array<Balance & { key: string; label: string }>; total?: Balance }) {
  return (
    <div className="scroll-cue overflow-x-auto rounded-lg border border-line bg-raised">
      <table className="w-full text-left text-sm">
        <caption className="px-3 pt-2 text-left text-xs font-semibold uppercase tracking-wide text-muted">{caption}</caption>
        <thead className="text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th scope="col" className="px-3 py-1.5 font-medium"><span className="sr-only">Who</span></th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Charged</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Credited</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Repaid</th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">Still owed</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className="border-t border-line">
              <th scope="row" className="px-3 py-1.5 font-normal">{r.label}</th>
              <td className="num px-3 py-1.5 text-right">{cell(r.chargedMinutes)}</td>
              <td className="num px-3 py-1.5 text-right">{cell(r.creditedMinutes)}</td>
              <td className="num px-3 py-1.5 text-right">{cell(r.repaidMinutes)}</td>
              <td className="num px-3 py-1.5 text-right font-semibold">{cell(r.owedMinutes)}</td>
            </tr>
          ))}
          {total && (
            <tr className="border-t-2 border-line">
              <th scope="row" className="px-3 py-1.5 font-semibold">All</th>
              <td className="num px-3 py-1.5 text-right">{cell(total.chargedMinutes)}</td>
              <td className="num px-3 py-1.5 text-right">{cell(total.creditedMinutes)}</td>
              <td className="num px-3 py-1.5 text-right">{cell(total.repaidMinutes)}</td>
              <td className="num px-3 py-1.5 text-right font-semibold">{cell(total.owedMinutes)}</td>
            </tr>
          )}
        </tbody>
      </table>
    </div>
  );
}
