import { describe, expect, it } from "vitest";
import { airmassKastenYoung, airmassSecZ, altitudeForAirmass } from "@/lib/sky";

describe("Kasten & Young (1989) airmass", () => {
  // Relative optical air mass, ISO Standard Atmosphere, from Kasten & Young, "Revised
  // optical air mass tables and approximation formula", Applied Optics 28 (1989) 4735,
  // table II — rows as quoted in public notes citing the paper (doi 10.1364/AO.28.004735);
  // the horizon value 38.0868 also matches the author's memory. The formula is their fit
  // to this table, so the check is relative: within 0.5 %.
  const table: [number, number][] = [
    [0, 38.0868],
    [1, 26.2595],
    [5, 10.3164],
    [10, 5.5841],
    [90, 1.0],
  ];
  it.each(table)("at %s° altitude is within 0.5 %% of the table's %s", (alt, value) => {
    const x = airmassKastenYoung(alt)!;
    expect(Math.abs(x - value) / value).toBeLessThan(0.005);
  });

  it("approaches sec z high in the sky: within 0.5 % above 30°, 0.1 % above 60°", () => {
    for (let alt = 30; alt <= 90; alt += 5) {
      const ratio = Math.abs(airmassKastenYoung(alt)! / airmassSecZ(alt)! - 1);
      expect(ratio).toBeLessThan(alt >= 60 ? 0.001 : 0.005);
    }
  });

  it("stays finite at the horizon where sec z blows up", () => {
    expect(airmassKastenYoung(0)).toBeCloseTo(37.92, 1);
    expect(airmassSecZ(0)).toBeNull();
    expect(airmassSecZ(0.01)!).toBeGreaterThan(5000);
  });

  it("is null below the horizon, never negative or huge", () => {
    for (const alt of [-0.0001, -1, -30, -90, Number.NaN]) {
      expect(airmassKastenYoung(alt)).toBeNull();
      expect(airmassSecZ(alt)).toBeNull();
    }
  });

  it("falls monotonically with altitude", () => {
    let previous = Infinity;
    for (let alt = 0; alt <= 90; alt += 0.5) {
      const x = airmassKastenYoung(alt)!;
      expect(x).toBeLessThan(previous);
      previous = x;
    }
  });

  it("altitudeForAirmass inverts it", () => {
    for (const x of [1.05, 1.2, 1.5, 2, 3, 5, 10, 30]) {
      expect(airmassKastenYoung(altitudeForAirmass(x))!).toBeCloseTo(x, 9);
    }
    expect(altitudeForAirmass(2)).toBeCloseTo(29.9, 1);
    expect(() => altitudeForAirmass(0.9)).toThrow(RangeError);
  });
});
