import { describe, expect, it } from "vitest";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import type { TelescopeSky } from "@/lib/requests/feasibility/types";
import { feasibilityInputSchema } from "@/lib/requests/schemas";
import { findSlots } from "@/lib/slot-finder/find-slots";
import { fadedUsableTime } from "@/lib/slot-finder/service";
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
  it("ends the usable time where the feasibility check's horizon ends: at the fade past the instrument's limit", () => {
    const start = Date.parse("2027-01-10T12:00:00Z");
    // H–G needs r and Δ; Δ (0.05 au at 05:30 UT) grows tenfold in 40 h, so the predicted V
    // crosses 17.8 late in the first night.
    const receding = Date.parse("2027-01-11T05:30:00Z");
    const rows = Array.from({ length: 49 }, (_, i) => {
      const time = start - 12 * 3_600_000 + i * 3_600_000;
      return { time: new Date(time).toISOString(), ra: 127.5, dec: -30, rAu: 1.05, deltaAu: 0.05 * Math.pow(10, (time - receding) / 3_600_000 / 40) };
    });
    const input = feasibilityInputSchema.parse({
      target: { kind: "ephemeris", ephemeris: rows, hMag: "24", gSlope: "" },
      telescopeIds: [telescope.id],
      durationMinutes: 60,
      earliestStart: "2027-01-10T12:00:00Z",
      latestEnd: "2027-01-13T12:00:00Z",
      deadline: "2027-01-13T12:00:00Z",
      constraints: { darkness: "nautical" },
    });
    const instrument = { id: "i-arc", telescopeId: telescope.id, code: "ARC", name: "Arc imager", limitingMagnitude: 17.8 };
    const requested = { start, end: Date.parse("2027-01-13T12:00:00Z") };
    const { usable, fade } = fadedUsableTime(input.target, instrument, requested);
    const report = computeFeasibility(input, [telescope], instrument, new Date(start));
    expect(fade).not.toBeNull();
    expect(new Date(fade!.at).toISOString().slice(0, 13)).toBe("2027-01-11T07");
    expect(usable.end).toBe(fade!.at);
    expect(usable.end).toBe(Date.parse(report.horizon.end));
    const finder = (horizon: { start: number; end: number }, cut: typeof fade) =>
      findSlots({ now: start, durationMinutes: 60, urgency: "within_days", horizon: requested, fade: cut, interruptSetupMinutes: 10, telescopes: [{ telescopeId: telescope.id, code: "AQ41", setupMinutes: 10, ...skyWindows(input, telescope, horizon), blocks: [] }] });
    // Without the fading clock the target has slots on the later nights too.
    expect(finder(requested, null).suggestions.some((s) => s.end > fade!.at)).toBe(true);
    const result = finder(usable, fade);
    expect(result.suggestions.length).toBeGreaterThan(0);
    for (const s of result.suggestions) expect(s.end).toBeLessThanOrEqual(fade!.at);
    expect(result.note).toMatch(/^No slot is offered after 2027-01-11 07:\d\d UT, when the target fades past ARC's limit V 17\.8: later slots cannot reach it\.$/);
  });
});
