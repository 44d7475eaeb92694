import { KindBadge } from "@/components/schedule/kind-badge";
import { TimeRange } from "@/components/time/time-range";
import { EmptyState } from "@/components/ui/empty-state";
import type { ScheduledBlock } from "@/lib/schedule/queries";

export function BlockList({ blocks, empty }: { blocks: ScheduledBlock[]; empty: string }) {
  if (!blocks.length) return <EmptyState>{empty}</EmptyState>;
  return (
    <div className="scroll-cue overflow-x-auto">
      <table className="w-full text-left text-sm">
        <thead className="text-2xs uppercase tracking-wide text-muted">
          <tr>
            <th className="py-1 pr-3 font-medium">When</th>
            <th className="py-1 pr-3 font-medium">Telescope</th>
            <th className="py-1 pr-3 font-medium">Program</th>
            <th className="py-1 font-medium">Kind</th>
          </tr>
        </thead>
        <tbody>
          {blocks.map((b) => (
            <tr key={b.id} className="border-t border-line align-top">
              <td className="py-1.5 pr-3"><TimeRange start={b.startsAt} end={b.endsAt} timeZone={b.telescope.timeZone} /></td>
              <td className="py-1.5 pr-3 whitespace-nowrap">{b.telescope.name}</td>
              <td className="min-w-44 py-1.5 pr-3"><span className="num">{b.program.code}</span> <span className="text-muted">{b.program.title}</span></td>
              <td className="py-1.5"><KindBadge kind={b.kind} /></td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
