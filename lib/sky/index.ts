/**
 * The sky engine: pure TypeScript, no database, no framework; runs in the browser and on
 * the server.
 *
 * Conventions
 * - Instants are UTC: epoch milliseconds (`Instant`, as `Date.getTime()`), or `Date` where
 *   noted. UT1 is taken equal to UTC. TT = UTC + ΔT with ΔT from the Espenak & Meeus (2006)
 *   polynomials (astronomy-engine's default model too). Every series takes T, Julian
 *   centuries of TT since J2000.0; sidereal time takes UT.
 * - Angles are degrees at the API (radians inside). Right ascension in degrees, [0, 360);
 *   hour angle positive west of the meridian; longitude east-positive (west is negative);
 *   latitude geodetic (WGS 84); azimuth from north through east (N 0°, E 90°, S 180°).
 * - Catalogue places are ICRS/J2000. Apparent places are referred to the true equator and
 *   equinox of date: precession IAU 1976 (Meeus ch. 21), nutation IAU 1980 with all 63
 *   terms (ch. 22), annual aberration with e-terms (ch. 23). Sidereal time: Meeus 12.4
 *   plus the equation of the equinoxes.
 * - Altitudes are geometric; atmospheric refraction (Sæmundsson, Meeus 16.4) is optional
 *   and off by default. Airmass: Kasten & Young (1989) on the geometric altitude, with the
 *   plane-parallel sec z for comparison; null below the horizon.
 * - Sun: VSOP87 truncated (Meeus ch. 25 higher accuracy, ~1″). Moon: Meeus ch. 47
 *   (~10″), topocentric by vector parallax; illuminated fraction from the topocentric
 *   phase angle (ch. 48). Moonrise/moonset for display: suncalc 2.0.2.
 * - Twilight: Sun's centre at −6° (civil), −12° (nautical), −18° (astronomical), geometric
 *   and topocentric; sunrise/sunset at −0.833°; no horizon dip. Events that do not happen
 *   are null.
 * - Coordinates typed as text: sexagesimal without marks is hours for RA, degrees for Dec;
 *   a bare decimal RA is degrees unless marked "h" (or parseRa is told otherwise).
 * - Moon limits (separation, illumination) bind only while the Moon is above the horizon;
 *   sun avoidance binds always.
 * - A night runs from local mean solar noon to the next and is named by the site's civil
 *   date (IANA time zone) on which it begins ("night of").
 * - Moving targets: ephemeris rows of geocentric astrometric RA/Dec (ICRS), optionally r,
 *   Δ (au) and magnitude; cubic Lagrange interpolation of the position vector (no RA wrap
 *   seam); topocentric parallax when Δ is given. Fading: IAU H–G (Bowell et al. 1989).
 * - Windows: per night one date frame (precession, nutation, aberration change < 0.2″ in a
 *   night) and sidereal time linear in time. Fixed targets in closed form
 *   (cos H = (sin h0 − sin φ sin δ)/(cos φ cos δ)); moving targets on a 1-minute grid
 *   walked in strides no margin can change sign within; Sun and Moon limits by bisection.
 *   Nutation, Sun and Moon come from interpolated tracks (SkyTracks) shared by the nights.
 */

export { DEG, normalizeDegrees, wrap180 } from "./angles";
export { airmassKastenYoung, airmassSecZ, altitudeForAirmass } from "./airmass";
export {
  apparentPlace,
  apparentPlaceAt,
  dateFrame,
  meanPlaceAt,
  type DateFrame,
  type ProperMotion,
} from "./apparent-place";
export {
  CoordinateParseError,
  formatDec,
  formatRa,
  parseDec,
  parseRa,
  parseRaDec,
  type FormatOptions,
  type RaParseOptions,
} from "./coordinates";
export {
  effectiveLimits,
  type EffectiveLimits,
  type FixedTarget,
  type MovingTarget,
  type PlanOptions,
  type RequestConstraints,
  type Target,
  type TelescopeLimits,
} from "./constraints";
export { Ephemeris, type EphemerisRow, type EphemerisSample } from "./ephemeris";
export { fadingClock, magnitudeAt, magnitudeHG, phaseAngleDeg, type FadingClock, type FadingInput } from "./fading";
export {
  horizontalFromHourAngle,
  horizontalPosition,
  type HorizontalOptions,
  type HorizontalPosition,
} from "./horizon";
export { type Interval } from "./intervals";
export {
  dateFromDayNumber,
  dayNumber,
  formatLocalIso,
  formatUtcIso,
  isValidTimeZone,
  timeZoneOffsetMs,
} from "./local-time";
export { illuminatedFraction, moonApparent, moonPosition, phaseAngleFromElongation } from "./moon";
export { nightOfInstant, nightSpan, nightsBetween, nightsFrom, type NightSpan } from "./nights";
export { meanObliquity, nutation, type Nutation } from "./nutation";
export {
  angularSeparationDeg,
  fixedTargetPosition,
  moonPositionFrom,
  sunPositionFrom,
  type MoonFromSite,
  type SkyPosition,
} from "./positions";
export { precessionAngles, precessionMatrix } from "./precession";
export { refractionDeg, trueFromApparentAltitude, type Atmosphere } from "./refraction";
export {
  equationOfEquinoxes,
  greenwichApparentSiderealTime,
  greenwichMeanSiderealTime,
  localSiderealTime,
} from "./sidereal-time";
export { type Site } from "./site";
export { sunApparent, sunPosition } from "./sun";
export {
  centuriesFromJde,
  centuriesTT,
  deltaTSeconds,
  julianDay,
  julianEphemerisDay,
  type Instant,
} from "./time-scales";
export { SkyTracks } from "./tracks";
export {
  DARKNESS_SUN_ALTITUDE,
  nightEvents,
  SUNRISE_SUNSET_ALTITUDE,
  type Darkness,
  type NightEvents,
} from "./twilight";
export {
  planNight,
  planNights,
  Planner,
  scanNights,
  type CurvePoint,
  type MoonSummary,
  type NightPlan,
  type NightSummary,
  type ObservableWindow,
  type PlanRequest,
  type SunAvoidanceStatus,
  type SunAvoidanceVerdict,
} from "./windows";
