import { formatLocal, formatUt, localDate } from "@/lib/time/format";

/** Calendar days from one YYYY-MM-DD to another. */
function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

/**
 * One end of the range: the clock alone on the same date, the clock marked "+1" on the
 * next date (before the zone, so it cannot be read as an offset), the full date beyond.
 */
function End({ text, days }: { text: string; days: number }) {
  const [date, clock, zone] = [text.slice(0, 10), text.slice(11, 16), text.slice(17)];
  return (
    <>
      {days > 1 ? `${date} ${clock}` : clock}
      {days === 1 && <sup>+1</sup>}
      {zone && ` ${zone}`}
    </>
  );
}

/**
 * A start–end pair on two lines: UT first, the site's local time below.
 */
export function TimeRange({ start, end, timeZone }: { start: Date; end: Date; timeZone: string }) {
  const utStart = formatUt(start);
  const utEnd = formatUt(end);
  const localStart = formatLocal(start, timeZone);
  const localEnd = formatLocal(end, timeZone);
  const localStartZone = localStart.slice(17);
  const localEndZone = localEnd.slice(17);
  return (
    <span className="num block whitespace-nowrap leading-tight">
      <time dateTime={start.toISOString()}>{utStart}</time>–
      <time dateTime={end.toISOString()}>
        <End text={utEnd} days={daysBetween(utStart.slice(0, 10), utEnd.slice(0, 10))} />
      </time>{" "}
      UT
      <span className="block text-2xs text-muted">
        {/* The zone is written once unless the site's clocks change within the range. */}
        {localStartZone === localEndZone ? localStart.slice(0, 16) : localStart}–
        <End text={localEnd} days={daysBetween(localDate(start, timeZone), localDate(end, timeZone))} /> local
      </span>
    </span>
  );
}
