import { describe, expect, it } from "vitest";
import { Ephemeris, fadingClock, magnitudeAt, magnitudeHG, phaseAngleDeg, sunPosition } from "@/lib/sky";

describe("IAU H–G magnitudes (Bowell et al. 1989)", () => {
  it("reproduces a published ephemeris: (3) Juno, JPL Horizons, 2013-Oct-23 07:12 UT", () => {
    // Horizons observer table row (as reproduced verbatim in a public repository):
    // APmag 9.87, r = 2.481634540222 au, delta = 2.16185095648959 au, S-T-O = 23.4642°.
    // Juno's H = 5.33, G = 0.32 are the catalogue values Horizons used — quoted from memory;
    // the printed 9.87 to its two decimals is the check that they are right.
    const v = magnitudeHG(5.33, 0.32, 2.481634540222, 2.16185095648959, 23.4642);
    expect(Math.abs(v - 9.87)).toBeLessThanOrEqual(0.005);
  });

  it("at zero phase reduces to H + 5 log10(r Δ) by definition of H", () => {
    expect(magnitudeHG(15, 0.15, 1, 1, 0)).toBeCloseTo(15, 12);
    expect(magnitudeHG(15, 0.15, 2, 3, 0)).toBeCloseTo(15 + 5 * Math.log10(6), 12);
  });

  it("a distant body fades ~3 mag when r and Δ both double (rule of thumb, common practice)", () => {
    // At the same phase angle the change is exactly 5 log10 4 = 3.01 mag; far from the Sun
    // doubling both distances keeps the phase angle nearly the same.
    const R = 1;
    const a1 = phaseAngleDeg(5, 4.2, R);
    const a2 = phaseAngleDeg(10, 9.1, R);
    const dv = magnitudeHG(10, 0.15, 10, 9.1, a2) - magnitudeHG(10, 0.15, 5, 4.2, a1);
    expect(dv).toBeGreaterThan(2.9);
    expect(dv).toBeLessThan(3.2);
    expect(magnitudeHG(10, 0.15, 10, 8, 5) - magnitudeHG(10, 0.15, 5, 4, 5)).toBeCloseTo(5 * Math.log10(4), 12);
  });

  it("darkens with phase angle, less so for larger G", () => {
    const drop = (G: number) => magnitudeHG(10, G, 1, 1, 30) - magnitudeHG(10, G, 1, 1, 0);
    expect(drop(0.15)).toBeGreaterThan(drop(0.5));
    expect(drop(0.15)).toBeGreaterThan(0.5);
  });

  it("phase angle from the Sun–target–Earth triangle", () => {
    expect(phaseAngleDeg(1, 1, Math.SQRT2)).toBeCloseTo(90, 10);
    expect(phaseAngleDeg(2, 1, 1)).toBeCloseTo(0, 6);
  });
});

describe("the fading clock", () => {
  // An invented object receding from both Sun and Earth; hourly rows over ten days.
  const t0 = Date.UTC(2030, 4, 1);
  const rows = Array.from({ length: 241 }, (_, i) => ({
    time: t0 + i * 3_600_000,
    raDeg: 200 + i * 0.01,
    decDeg: -10 + i * 0.005,
    rAu: 1.05 + i * 0.0008,
    deltaAu: 0.08 + i * 0.0018,
    magnitude: 14 + i * 0.02,
  }));
  const ephemeris = new Ephemeris(rows);

  it("finds when the H–G magnitude passes the limit, to the second", () => {
    const curve = fadingClock({ ephemeris, H: 20, G: 0.15, limitingMagnitude: 99 }).curve;
    // It fades by more than two magnitudes over the table; put the limit half way, off a row.
    expect(curve[240]!.magnitude).toBeGreaterThan(curve[0]!.magnitude + 2);
    const limit = curve[120]!.magnitude + 0.003;
    const clock = fadingClock({ ephemeris, H: 20, G: 0.15, limitingMagnitude: limit });
    expect(clock.source).toBe("H-G");
    expect(clock.alreadyFainter).toBe(false);
    const t = clock.fainterThanLimitAt!;
    expect(t).toBeGreaterThan(t0 + 120 * 3_600_000);
    expect(t).toBeLessThan(t0 + 122 * 3_600_000);
    const input = { ephemeris, H: 20, G: 0.15, limitingMagnitude: limit };
    expect(magnitudeAt(input, t)!).toBeGreaterThan(limit);
    expect(magnitudeAt(input, t - 2000)!).toBeLessThanOrEqual(limit);
    // Cross-check one point by hand: r, Δ, phase from the row and our Sun.
    const row = rows[100]!;
    const R = sunPosition(row.time).distanceAu;
    const expected = magnitudeHG(20, 0.15, row.rAu, row.deltaAu, phaseAngleDeg(row.rAu, row.deltaAu, R));
    expect(magnitudeAt(input, row.time)).toBeCloseTo(expected, 6);
  });

  it("uses the table's own magnitudes when no H is given", () => {
    const clock = fadingClock({ ephemeris, limitingMagnitude: 16 });
    expect(clock.source).toBe("ephemeris");
    expect(Math.abs(clock.fainterThanLimitAt! - (t0 + 100 * 3_600_000))).toBeLessThanOrEqual(1000);
  });

  it("says so when the target is already too faint, or stays bright past the table", () => {
    expect(fadingClock({ ephemeris, limitingMagnitude: 13 }).alreadyFainter).toBe(true);
    const bright = fadingClock({ ephemeris, limitingMagnitude: 25 });
    expect(bright.fainterThanLimitAt).toBeNull();
    expect(bright.coverageEnd).toBe(rows[rows.length - 1]!.time);
  });
});
