import { clockLocal, clockUt } from "./time-format";

/** One instant as "23:40 UT · 20:40 GMT-3": UT and the site's local time side by side. */
export function TimePair({ at, timeZone, className }: { at: string; timeZone: string; className?: string }) {
  return (
    <span className={`num whitespace-nowrap ${className ?? ""}`}>
      <time dateTime={at}>{clockUt(at)} UT</time>
      <span className="text-muted"> · {clockLocal(at, timeZone)}</span>
    </span>
  );
}
