import { describe, expect, it } from "vitest";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import type { TelescopeSky } from "@/lib/requests/feasibility/types";
import { feasibilityInputSchema } from "@/lib/requests/schemas";
import { skyWindows } from "@/lib/slot-finder/sky";

const telescope: TelescopeSky = {
  id: "00000000-0000-4000-8000-000000000041",
  code: "AQ41",
  name: "Quebrada 4.1 m",
  minAltitudeDeg: 25,
  maxAirmass: 2.4,
  sunAvoidanceDeg: 45,
  hourAngleMinH: -5,
  hourAngleMaxH: 5,
  site: { id: "s", code: "AQS", name: "Alto Quebrada Station", latitudeDeg: -30.52, longitudeDeg: -70.41, heightM: 2310, timeZone: "America/Santiago" },
};

describe("the slot finder's windows come from the same sky as the feasibility check", () => {
  it("finds the feasibility check's windows, with airmass samples inside them", () => {
    const input = feasibilityInputSchema.parse({
      target: { kind: "fixed", ra: "08:30:00", dec: "-30:00:00" },
      telescopeIds: [telescope.id],
      durationMinutes: 60,
      earliestStart: "2027-01-10T12:00:00Z",
      latestEnd: "2027-01-13T12:00:00Z",
      deadline: "2027-01-13T12:00:00Z",
      constraints: { darkness: "nautical" },
    });
    const usable = { start: Date.parse("2027-01-10T12:00:00Z"), end: Date.parse("2027-01-13T12:00:00Z") };
    const sky = skyWindows(input, telescope, usable);
    const report = computeFeasibility(input, [telescope], null, new Date(usable.start));
    const expected = report.telescopes[0]!.nights.flatMap((n) => n.windows).map((w) => [Date.parse(w.start), Date.parse(w.end)]);
    const ours = sky.windows.map((w) => [Math.max(w.start, usable.start), Math.min(w.end, usable.end)]);
    expect(ours).toHaveLength(expected.length);
    ours.forEach(([s, e], i) => {
      expect(Math.abs(s! - expected[i]![0]!)).toBeLessThan(1000);
      expect(Math.abs(e! - expected[i]![1]!)).toBeLessThan(1000);
    });
    expect(sky.windows.length).toBeGreaterThanOrEqual(3);
    for (const a of sky.airmass) {
      expect(sky.windows.some((w) => a.t >= w.start - 1 && a.t <= w.end + 1)).toBe(true);
      expect(a.airmass).not.toBeNull();
      expect(a.airmass!).toBeLessThanOrEqual(2.4 + 1e-6);
    }
  });
});
