/**
 * When a payback block may run: wholly within one night at the telescope's site, while
 * the Sun is below the horizon (sunset to sunrise, Sun's centre at −0.833°). The night is
 * the sky engine's noon-to-noon night the block's start falls in. Sunset is rounded up and
 * sunrise down to the whole minute, so the times the refusal names are the exact limits.
 * Pure: no database.
 */
import { nightEvents, nightOfInstant, SUNRISE_SUNSET_ALTITUDE, type NightEvents, type Site } from "@/lib/sky";
import { formatLocal, formatUt } from "@/lib/time/format";

export type PaybackTimeField = "startsAt" | "endsAt";

export interface NightRefusal {
  message: string;
  /** The fields that lie outside the dark time, each with the message. */
  fields: PaybackTimeField[];
}

const MINUTE = 60_000;
const ceilMinute = (t: number) => Math.ceil(t / MINUTE) * MINUTE;
const floorMinute = (t: number) => Math.floor(t / MINUTE) * MINUTE;

/** "2026-12-02 23:41 UT (20:41 GMT-3)"; the local date is shown only when it differs. */
function utAndLocal(t: number, timeZone: string): string {
  const ut = formatUt(new Date(t));
  const local = formatLocal(new Date(t), timeZone);
  return `${ut} UT (${local.slice(0, 10) === ut.slice(0, 10) ? local.slice(11) : local})`;
}

interface DarkTime {
  start: number;
  end: number;
  /** How each limit reads: "sunset at …", or the night's own edge where the Sun does not set or rise. */
  from: string;
  until: string;
}

function darkTime(night: NightEvents, timeZone: string): DarkTime | null {
  const { sunset, sunrise } = night;
  // No crossing at all: the Sun stays up all night (midnight sun) or down all day (polar night).
  if (sunset === null && sunrise === null && night.sunAltitudeAtMidnightDeg >= SUNRISE_SUNSET_ALTITUDE) return null;
  const start = ceilMinute(sunset ?? night.start);
  const end = floorMinute(sunrise ?? night.end);
  if (end <= start) return null;
  return {
    start,
    end,
    from: sunset === null ? `local noon at ${utAndLocal(start, timeZone)}, as it did not rise that day,` : `sunset at ${utAndLocal(start, timeZone)}`,
    until: sunrise === null ? `local noon at ${utAndLocal(end, timeZone)}, as it does not rise before then` : `sunrise at ${utAndLocal(end, timeZone)}`,
  };
}

/**
 * Why a payback block from start to end cannot run at the site, or null when it lies in
 * the dark part of one night. The site must carry its IANA time zone.
 */
export function paybackNightRefusal(site: Site & { name: string; timeZone: string }, start: Date, end: Date): NightRefusal | null {
  const s = start.getTime();
  const e = end.getTime();
  const night = nightEvents(site, nightOfInstant(site, s).nightOf);
  const dark = darkTime(night, site.timeZone);
  if (!dark) {
    return {
      message: `The Sun does not set at ${site.name} on the night of ${night.nightOf}: there is no dark time for a payback block that night. Choose a night when the Sun sets. Nothing was saved.`,
      fields: ["startsAt", "endsAt"],
    };
  }
  if (s >= dark.start && e <= dark.end) return null;

  let problem: string;
  let fields: PaybackTimeField[];
  const pastEnd = night.sunrise === null ? "runs past local noon, the end of that night," : "runs past sunrise";
  if (s >= dark.end || e <= dark.start) {
    problem = `That time is in daylight at ${site.name}.`;
    fields = ["startsAt", "endsAt"];
  } else if (s < dark.start && e > dark.end) {
    problem = `That block starts before sunset and ${pastEnd} at ${site.name}.`;
    fields = ["startsAt", "endsAt"];
  } else if (s < dark.start) {
    problem = `That block starts before sunset at ${site.name}.`;
    fields = ["startsAt"];
  } else {
    problem = `That block ${pastEnd} at ${site.name}.`;
    fields = ["endsAt"];
  }
  return {
    message: `${problem} On the night of ${night.nightOf} the Sun is down from ${dark.from} to ${dark.until}: a payback block must lie wholly within that time. Nothing was saved.`,
    fields,
  };
}
