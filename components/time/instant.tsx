import { formatLocal, formatUt } from "@/lib/time/format";

/** An instant in UT with the site's local time beside it. */
export function Instant({ at, timeZone }: { at: Date; timeZone: string }) {
  return (
    <span className="num whitespace-nowrap">
      <time dateTime={at.toISOString()}>{formatUt(at)} UT</time>
      <span className="text-muted"> · {formatLocal(at, timeZone)}</span>
    </span>
  );
}
