/**
 * Instants are stored and passed as UTC; people read them in UT and in the site's local
 * time side by side. Intl does the time-zone work (IANA names, DST included).
 */
const utcFormat = new Intl.DateTimeFormat("en-GB", {
  timeZone: "UTC",
  year: "numeric",
  month: "2-digit",
  day: "2-digit",
  hour: "2-digit",
  minute: "2-digit",
  hourCycle: "h23",
});

function parts(fmt: Intl.DateTimeFormat, date: Date): Record<string, string> {
  return Object.fromEntries(fmt.formatToParts(date).map((p) => [p.type, p.value]));
}

/** "2026-12-01 22:54" in UT. */
export function formatUt(date: Date): string {
  const p = parts(utcFormat, date);
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}`;
}

const localFormats = new Map<string, Intl.DateTimeFormat>();

function localFormat(timeZone: string): Intl.DateTimeFormat {
  let fmt = localFormats.get(timeZone);
  if (!fmt) {
    fmt = new Intl.DateTimeFormat("en-GB", {
      timeZone,
      year: "numeric",
      month: "2-digit",
      day: "2-digit",
      hour: "2-digit",
      minute: "2-digit",
      hourCycle: "h23",
      timeZoneName: "short",
    });
    localFormats.set(timeZone, fmt);
  }
  return fmt;
}

/** "2026-12-01 19:54 GMT-3" in the site's zone. */
export function formatLocal(date: Date, timeZone: string): string {
  const p = parts(localFormat(timeZone), date);
  return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute} ${p.timeZoneName}`;
}

/** The local calendar date (YYYY-MM-DD) of an instant at a site. */
export function localDate(date: Date, timeZone: string): string {
  const p = parts(localFormat(timeZone), date);
  return `${p.year}-${p.month}-${p.day}`;
}

export function formatDuration(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = Math.round(minutes % 60);
  return h ? `${h} h ${String(m).padStart(2, "0")} min` : `${m} min`;
}
