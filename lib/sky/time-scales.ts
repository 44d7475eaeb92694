// UTC in, TT out. UT1 is taken equal to UTC (|DUT1| < 0.9 s moves the sky by < 14″ of
// hour angle at most, and leap-second tables would need updating forever).
// TT = UT + ΔT with ΔT from the Espenak & Meeus (2006) polynomials — the model the
// NASA eclipse pages publish and astronomy-engine uses by default. In the 2020s it runs
// ~5 s ahead of the measured ΔT; only the Moon notices (≈2.5″).

/** An instant: milliseconds since 1970-01-01T00:00:00Z (UTC), like Date.getTime(). */
export type Instant = number;

export const MS_PER_DAY = 86_400_000;
/** J2000.0 = JD 2451545.0 = 2000-01-01T12:00:00 (as UT). */
export const J2000_MS = Date.UTC(2000, 0, 1, 12);
const JD_UNIX_EPOCH = 2440587.5;

export function toInstant(t: Date | number): Instant {
  return typeof t === "number" ? t : t.getTime();
}

export function julianDay(t: Instant): number {
  return t / MS_PER_DAY + JD_UNIX_EPOCH;
}

export function instantFromJulianDay(jd: number): Instant {
  return (jd - JD_UNIX_EPOCH) * MS_PER_DAY;
}

/** Days of UT since J2000.0. */
export function daysSinceJ2000(t: Instant): number {
  return (t - J2000_MS) / MS_PER_DAY;
}

/** ΔT = TT − UT in seconds (Espenak & Meeus 2006 polynomial fits). */
export function deltaTSeconds(t: Instant): number {
  // Same decimal-year convention as the published fits (y = 2000.0 near 2000 Jan 15).
  const y = 2000 + (daysSinceJ2000(t) - 14) / 365.24217;
  let u: number;
  if (y < 1600) {
    u = (y - 1820) / 100;
    return -20 + 32 * u * u;
  }
  if (y < 1700) {
    u = y - 1600;
    return 120 - 0.9808 * u - 0.01532 * u * u + (u * u * u) / 7129;
  }
  if (y < 1800) {
    u = y - 1700;
    return 8.83 + u * (0.1603 + u * (-0.0059285 + u * (0.00013336 - u / 1174000)));
  }
  if (y < 1860) {
    u = y - 1800;
    return (
      13.72 +
      u *
        (-0.332447 +
          u *
            (0.0068612 +
              u * (0.0041116 + u * (-0.00037436 + u * (0.0000121272 + u * (-0.0000001699 + u * 0.000000000875))))))
    );
  }
  if (y < 1900) {
    u = y - 1860;
    return 7.62 + u * (0.5737 + u * (-0.251754 + u * (0.01680668 + u * (-0.0004473624 + u / 233174))));
  }
  if (y < 1920) {
    u = y - 1900;
    return -2.79 + u * (1.494119 + u * (-0.0598939 + u * (0.0061966 - u * 0.000197)));
  }
  if (y < 1941) {
    u = y - 1920;
    return 21.2 + u * (0.84493 + u * (-0.0761 + u * 0.0020936));
  }
  if (y < 1961) {
    u = y - 1950;
    return 29.07 + u * (0.407 + u * (-1 / 233 + u / 2547));
  }
  if (y < 1986) {
    u = y - 1975;
    return 45.45 + u * (1.067 + u * (-1 / 260 - u / 718));
  }
  if (y < 2005) {
    u = y - 2000;
    return 63.86 + u * (0.3345 + u * (-0.060374 + u * (0.0017275 + u * (0.000651814 + u * 0.00002373599))));
  }
  if (y < 2050) {
    u = y - 2000;
    return 62.92 + u * (0.32217 + u * 0.005589);
  }
  u = (y - 1820) / 100;
  if (y < 2150) return -20 + 32 * u * u - 0.5628 * (2150 - y);
  return -20 + 32 * u * u;
}

/** Julian Ephemeris Day (TT) of a UTC instant. */
export function julianEphemerisDay(t: Instant): number {
  return julianDay(t) + deltaTSeconds(t) / 86400;
}

/** Julian centuries of TT since J2000.0 — the time argument of every series in the engine. */
export function centuriesTT(t: Instant): number {
  return (julianEphemerisDay(t) - 2451545.0) / 36525;
}

/** Julian centuries of TT from a Julian Ephemeris Day (for the book's worked examples). */
export function centuriesFromJde(jde: number): number {
  return (jde - 2451545.0) / 36525;
}
