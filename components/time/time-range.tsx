import { formatLocal, formatUt, localDate } from "@/lib/time/format";

function clock(text: string): string {
  return text.slice(11);
}

/**
 * A start–end pair on two lines: UT first, the site's local time below.
 * "+1" marks an end that falls on the next calendar date.
 */
export function TimeRange({ start, end, timeZone }: { start: Date; end: Date; timeZone: string }) {
  const utStart = formatUt(start);
  const utEnd = formatUt(end);
  const localStart = formatLocal(start, timeZone);
  const localEnd = formatLocal(end, timeZone);
  const utNextDay = utStart.slice(0, 10) !== utEnd.slice(0, 10);
  const localNextDay = localDate(start, timeZone) !== localDate(end, timeZone);
  return (
    <span className="num block whitespace-nowrap leading-tight">
      <time dateTime={start.toISOString()}>{utStart}</time>–<time dateTime={end.toISOString()}>{clock(utEnd).slice(0, 5)}</time>
      {utNextDay && <sup>+1</sup>} UT
      <span className="block text-2xs text-muted">
        {localStart.slice(0, 16)}–{clock(localEnd)}
        {localNextDay && <sup>+1</sup>} local
      </span>
    </span>
  );
}
