import { formatLocal, formatUt } from "@/lib/time/format";

/**
 * An instant in UT with the site's local time beside it. In a narrow cell the local time
 * drops to the next line as a whole; neither half is broken. `stacked` always puts it on
 * a smaller second line, as <TimeRange> does.
 */
export function Instant({ at, timeZone, stacked = false }: { at: Date; timeZone: string; stacked?: boolean }) {
  if (stacked) {
    return (
      <span className="num block leading-tight">
        <time dateTime={at.toISOString()}>{formatUt(at)} UT</time>
        <span className="block text-2xs text-muted">{formatLocal(at, timeZone)} local</span>
      </span>
    );
  }
  return (
    <span className="num">
      <time dateTime={at.toISOString()} className="whitespace-nowrap">
        {formatUt(at)} UT
      </time>{" "}
      <span className="whitespace-nowrap text-muted">· {formatLocal(at, timeZone)}</span>
    </span>
  );
}
