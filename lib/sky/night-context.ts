// Everything about one night that does not depend on the target: the date frame (one
// precession–nutation–aberration evaluation at the night's midpoint) and local sidereal
// time as a linear function of time.

import { DEG } from "./angles";
import { type DateFrame, dateFrame } from "./apparent-place";
import type { NightSpan } from "./nights";
import { greenwichMeanSiderealTime, SIDEREAL_RATE } from "./sidereal-time";
import { type Site, type SiteGeometry, siteGeometry } from "./site";
import { centuriesTT, type Instant } from "./time-scales";
import type { SkyTracks } from "./tracks";

export interface NightContext {
  site: Site;
  geo: SiteGeometry;
  span: NightSpan;
  mid: Instant;
  frame: DateFrame;
  /** Local apparent sidereal time at `mid`, radians (unwrapped). */
  lastMid: number;
  tracks: SkyTracks;
}

export function createNightContext(
  site: Site,
  span: NightSpan,
  tracks: SkyTracks,
  geo: SiteGeometry = siteGeometry(site),
): NightContext {
  const mid = (span.start + span.end) / 2;
  const frame = dateFrame(centuriesTT(mid), tracks.nutationAt(mid));
  const lastMid = greenwichMeanSiderealTime(mid) * DEG + frame.equationOfEquinoxes + geo.lon;
  return { site, geo, span, mid, frame, lastMid, tracks };
}

// Module-local copy: imported bindings are getter calls in some bundlers, and this is hot.
const RATE = SIDEREAL_RATE;

/** Local apparent sidereal time at t, radians (unwrapped; only differences matter). */
export function lastAt(ctx: NightContext, t: Instant): number {
  return ctx.lastMid + RATE * (t - ctx.mid);
}
