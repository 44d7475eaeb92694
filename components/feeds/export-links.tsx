import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { FeedTargets } from "@/lib/calendar-feeds/queries";

const EXPORT = "/api/v1/schedule/export";

/** Direct downloads of the export route; a plain GET form, so no script is needed. */
export function ExportLinks({ userId, targets }: { userId: string; targets: FeedTargets }) {
  return (
    <div className="flex flex-col gap-4">
      <p className="flex flex-wrap items-center gap-3">
        <span>My observer blocks:</span>
        <a className={buttonClass("quiet")} href={`${EXPORT}?format=ics&observer=${userId}`} download>iCalendar (.ics)</a>
        <a className={buttonClass("quiet")} href={`${EXPORT}?format=csv&observer=${userId}`} download>CSV</a>
      </p>
      <form method="get" action={EXPORT} className="flex flex-wrap items-end gap-3" aria-label="Download the schedule">
        <label className="flex flex-col gap-1">
          <span className="text-xs font-semibold uppercase tracking-wide text-muted">Telescope</span>
          <select name="telescope" className={inputClass} defaultValue="">
            <option value="">All telescopes</option>
            {targets.telescopes.map((t) => (
              <option key={t.id} value={t.id}>{t.code} — {t.name}</option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1">
          <span className="text-xs font-semibold uppercase tracking-wide text-muted">Program</span>
          <select name="program" className={inputClass} defaultValue="">
            <option value="">All programs</option>
            {targets.programs.map((p) => (
              <option key={p.id} value={p.id}>{p.code} — {p.title}</option>
            ))}
          </select>
        </label>
        <button type="submit" name="format" value="ics" className={buttonClass("quiet")}>Download iCalendar</button>
        <button type="submit" name="format" value="csv" className={buttonClass("quiet")}>Download CSV</button>
      </form>
      <p className="text-xs text-muted">The CSV uses the import columns, with times in each site's local time and its UTC offset.</p>
    </div>
  );
}
