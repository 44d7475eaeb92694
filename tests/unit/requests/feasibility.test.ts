// The feasibility check, pure: verdicts per telescope, the refusal reasons, the charts'
// sky shared by telescopes of one site, and the fading clock. A fixed "now" and targets
// placed relative to the Sun keep every case independent of the calendar.
import { describe, expect, it } from "vitest";
import { CHART_NIGHTS, computeFeasibility } from "@/lib/requests/feasibility/compute";
import { visibilityRequest, visibilityTarget } from "@/lib/requests/feasibility/inputs";
import { toSnapshot } from "@/lib/requests/feasibility/snapshot";
import type { FeasibilityReport, InstrumentRef, TelescopeSky } from "@/lib/requests/feasibility/types";
import { feasibilityInputSchema, type RequestFormValues } from "@/lib/requests/schemas";
import { nextWindowOf } from "@/lib/review/order";
import { formatDec, formatRa, sunPosition } from "@/lib/sky";
import { formatUt } from "@/lib/time/format";
import { computeVisibility } from "@/lib/visibility";

const NOW = new Date("2027-03-10T15:00:00Z");
const HOUR = 3_600_000;
const site = { id: "site-s", code: "SS", name: "Southern site", latitudeDeg: -30, longitudeDeg: -70, heightM: 2000, timeZone: "America/Santiago" };
const scope = (id: string, code: string, sunAvoidanceDeg: number): TelescopeSky => ({
  id,
  code,
  name: `Scope ${code}`,
  minAltitudeDeg: 20,
  maxAirmass: 2.9,
  sunAvoidanceDeg,
  hourAngleMinH: -6,
  hourAngleMaxH: 6,
  site,
});
const big = scope("t-big", "BIG", 45);
const small = scope("t-small", "SML", 30);
const camera: InstrumentRef = { id: "i-cam", telescopeId: "t-big", code: "CAM", name: "Camera", limitingMagnitude: 21 };

const sun = sunPosition(NOW.getTime());
const antiSolar = { ra: formatRa((sun.raDeg + 180) % 360), dec: "-30:00:00" };

/** Hourly rows opposite the Sun from 12 h before NOW, with r and Δ for H–G magnitudes. */
function antiSolarEphemeris() {
  return Array.from({ length: 97 }, (_, i) => ({
    time: new Date(NOW.getTime() - 12 * HOUR + i * HOUR).toISOString(),
    ra: ((sun.raDeg + 180) % 360) + i * 0.05,
    dec: -30 + i * 0.02,
    rAu: 1.1 + i * 0.004,
    deltaAu: 0.2 + i * 0.006,
  }));
}

function input(target: RequestFormValues["target"], overrides: Partial<Record<"latestEnd" | "deadline" | "durationMinutes", string>> = {}) {
  return feasibilityInputSchema.parse({
    target,
    telescopeIds: ["00000000-0000-4000-8000-000000000001"],
    durationMinutes: overrides.durationMinutes ?? "60",
    earliestStart: NOW.toISOString(),
    latestEnd: overrides.latestEnd ?? new Date(NOW.getTime() + 72 * HOUR).toISOString(),
    deadline: overrides.deadline ?? new Date(NOW.getTime() + 72 * HOUR).toISOString(),
    constraints: { darkness: "nautical", maxAirmass: "2.5" },
  });
}

describe("computeFeasibility", () => {
  it("finds windows for a target opposite the Sun, inside the horizon, and charts the first nights once per site", () => {
    const report = computeFeasibility(input({ kind: "fixed", ...antiSolar }), [big, small], null, NOW);
    expect(report.verdict).toBe("feasible");
    expect(report.reasons).toEqual([]);
    expect(report.telescopes.map((t) => t.verdict)).toEqual(["feasible", "feasible"]);
    expect(report.skies).toHaveLength(1);
    // Every night of the window is charted but the one already over at NOW (daytime in Chile).
    expect(report.telescopes[0]?.nights.map((n) => n.nightOf)).toEqual(["2027-03-09", "2027-03-10", "2027-03-11", "2027-03-12"]);
    expect(report.skies[0]?.nights.map((n) => n.nightOf)).toEqual(["2027-03-10", "2027-03-11", "2027-03-12"]);
    expect(report.skies[0]!.nights.length).toBeLessThanOrEqual(CHART_NIGHTS);
    for (const night of report.skies[0]!.nights) expect(night.samples.t.length).toBeGreaterThan(40);
    const windows = report.telescopes.flatMap((t) => t.nights.flatMap((n) => n.windows));
    for (const w of windows) {
      expect(Date.parse(w.start)).toBeGreaterThanOrEqual(NOW.getTime());
      expect(Date.parse(w.end)).toBeLessThanOrEqual(NOW.getTime() + 72 * HOUR);
    }
    expect(report.telescopes[0]?.airmassLimit).toBeCloseTo(2.5, 2);
    expect(report.telescopes[0]?.reason).toMatch(/^First window long enough on BIG: \d{4}-\d\d-\d\d \d\d:\d\d–\d\d:\d\d UT \(\d+ min, best airmass 1\.\d\d\)\.$/);
    expect(report.disclaimer).toMatch(/Planning aid only.*refused, never scheduled/);
  });

  it("refuses a target inside the sun avoidance limit on every night, naming the telescope", () => {
    const report = computeFeasibility(input({ kind: "fixed", ra: formatRa(sun.raDeg), dec: formatDec(sun.decDeg) }), [big, small], null, NOW);
    expect(report.verdict).toBe("refused");
    expect(report.telescopes.map((t) => t.verdict)).toEqual(["sun_refused", "sun_refused"]);
    expect(report.reasons).toHaveLength(2);
    expect(report.reasons[0]).toMatch(/^Refused for sun avoidance on BIG: .*45\.0° limit\. Remove BIG from the acceptable telescopes or change the window\.$/);
    expect(report.reasons[1]).toMatch(/^Refused for sun avoidance on SML: .*30\.0° limit\./);
  });

  it("refuses a request whose deadline has passed, or that has no window long enough", () => {
    const inAnHour = new Date(NOW.getTime() + HOUR).toISOString();
    const window = input({ kind: "fixed", ...antiSolar }, { latestEnd: inAnHour, deadline: inAnHour, durationMinutes: "30" });
    const passed = computeFeasibility(window, [big], null, new Date(NOW.getTime() + 2 * HOUR));
    expect(passed.verdict).toBe("refused");
    expect(passed.telescopes[0]?.reason).toMatch(/has passed: there is no time left to observe/);

    const neverRises = computeFeasibility(input({ kind: "fixed", ra: "06:00:00", dec: "+80:00:00" }), [big], null, NOW);
    expect(neverRises.reasons[0]).toBe("No observable window of 60 min before the deadline on any acceptable telescope.");
    expect(neverRises.telescopes[0]?.verdict).toBe("no_window");

    const tooLong = computeFeasibility(input({ kind: "fixed", ...antiSolar }, { durationMinutes: "700" }), [big], null, NOW);
    expect(tooLong.telescopes[0]?.reason).toMatch(/^The longest observable window on BIG before the deadline is \d+ min; the request needs 700 min\.$/);
  });

  it("plans a moving target from its ephemeris and runs the fading clock against the instrument", () => {
    const rows = antiSolarEphemeris();
    const report = computeFeasibility(input({ kind: "ephemeris", ephemeris: rows, hMag: "19", gSlope: "" }), [big], camera, NOW);
    expect(report.telescopes[0]?.verdict).toBe("feasible");
    expect(report.fading).toMatchObject({ source: "H-G", limitingMagnitude: 21, instrument: "CAM — Camera" });
    expect(report.fading?.curve.length).toBeGreaterThan(10);
    expect(report.fading?.reason).toMatch(/CAM's limit V = 21\.0/);
  });

  it("keeps verdicts and windows but no chart samples in the snapshot stored at filing", () => {
    const rows = Array.from({ length: 10 }, (_, i) => ({ time: new Date(NOW.getTime() + i * 6 * HOUR).toISOString(), ra: 120, dec: -30, magnitude: 18 + i * 0.5 }));
    const snapshot = toSnapshot(computeFeasibility(input({ kind: "ephemeris", ephemeris: rows }), [big], camera, NOW));
    expect(snapshot).not.toHaveProperty("skies");
    expect(snapshot.fading).not.toHaveProperty("curve");
    expect(snapshot.fading?.source).toBe("ephemeris");
    expect(snapshot.telescopes[0]?.nights.length).toBeGreaterThan(0);
  });

  it("charts and windows the same numbers as the public visibility answer for the same night", () => {
    const request = input({ kind: "fixed", ...antiSolar });
    const report = computeFeasibility(request, [big], null, NOW);
    const night = report.skies[0]!.nights[0]!;
    const visibility = computeVisibility(visibilityRequest(request, big, visibilityTarget(request.target), { night: night.nightOf }));
    const points = visibility.curve!.points;
    expect(night.samples.t).toEqual(points.map((p) => Date.parse(p.time)));
    expect(night.samples.airmass).toEqual(points.map((p) => p.airmass));
    expect(night.samples.moonAltitudeDeg).toEqual(points.map((p) => p.moonAltitudeDeg));
    expect(night.twilight).toEqual(visibility.nights[0]!.twilight);
    const windows = visibility.nights[0]!.windows.map((w) => ({ start: Date.parse(w.start.utc), end: Date.parse(w.end.utc), bestAirmass: w.bestAirmass }));
    const clipped = report.telescopes[0]!.nights.find((n) => n.nightOf === night.nightOf)!.windows.map((w) => ({ start: Date.parse(w.start), end: Date.parse(w.end), bestAirmass: w.bestAirmass }));
    expect(windows.length).toBeGreaterThan(0);
    // The report clips windows to its horizon (from NOW on): the ends and best airmass agree.
    expect(clipped.map((w) => [w.end, w.bestAirmass])).toEqual(windows.filter((w) => w.end > NOW.getTime()).map((w) => [w.end, w.bestAirmass]));
  });
});

describe("the fading clock in the verdict", () => {
  // An ephemeris opposite the Sun whose own magnitudes cross CAM's limit (V 21) at `fadeAt`,
  // a tenth of a magnitude an hour: the windows stay where they are, only the fade moves.
  const fadingRows = (fadeAt: number) =>
    Array.from({ length: 97 }, (_, i) => {
      const time = NOW.getTime() - 12 * HOUR + i * HOUR;
      return { time: new Date(time).toISOString(), ra: ((sun.raDeg + 180) % 360) + i * 0.05, dec: -30 + i * 0.02, magnitude: 21 + ((time - fadeAt) / HOUR) * 0.1 };
    });
  const fadingTarget = (fadeAt: number) => input({ kind: "ephemeris", ephemeris: fadingRows(fadeAt) });
  const windowsOf = (report: FeasibilityReport) => report.telescopes.flatMap((t) => t.nights.flatMap((n) => n.windows));
  // Without an instrument there is no fading clock: these are the target's windows.
  const sky = computeFeasibility(fadingTarget(NOW.getTime()), [big], null, NOW);
  const [tonight, tomorrow] = windowsOf(sky);
  const fadeOf = (report: FeasibilityReport) => Date.parse(report.fading!.fainterThanLimitAt!);

  it("has a long first window and more on the nights after (the ground the cases stand on)", () => {
    expect(sky.verdict).toBe("feasible");
    expect(tonight!.durationMinutes).toBeGreaterThan(180);
    expect(Date.parse(tomorrow!.start)).toBeGreaterThan(Date.parse(tonight!.end));
  });

  it("refuses when the only windows long enough come after the fade, naming the fade time", () => {
    // Fades 30 min into tonight's window: tomorrow's windows are long enough but too late.
    const fadeAt = Date.parse(tonight!.start) + 30 * 60_000;
    const report = computeFeasibility(fadingTarget(fadeAt), [big], camera, NOW);
    const fade = fadeOf(report);
    expect(Math.abs(fade - fadeAt)).toBeLessThan(2000);
    const when = `${formatUt(new Date(Math.floor(fade / 1000) * 1000))} UT`;
    expect(report.verdict).toBe("refused");
    expect(report.telescopes[0]?.verdict).toBe("no_window");
    expect(report.telescopes[0]?.firstSlot).toBeNull();
    expect(report.telescopes[0]?.reason).toBe(`The longest observable window on BIG before the target fades past CAM's limit V 21.0 at ${when} is 30 min; the request needs 60 min.`);
    expect(report.reasons[0]).toBe(`No observable window of 60 min before the target fades past CAM's limit V 21.0 at ${when} on any acceptable telescope.`);
    expect(report.reasons.join(" ")).not.toMatch(/deadline/);
    for (const w of windowsOf(report)) expect(Date.parse(w.end)).toBeLessThanOrEqual(fade);
    expect(Date.parse(report.horizon.end)).toBeLessThanOrEqual(fade);
    expect(report.notes.some((n) => n.startsWith("The target is predicted to fade past the instrument's limit at"))).toBe(true);

    // Faded before tonight's window even opens: no window at all, and the reason says until when.
    const early = computeFeasibility(fadingTarget(Date.parse(tonight!.start) - HOUR), [big], camera, NOW);
    expect(early.verdict).toBe("refused");
    expect(windowsOf(early)).toEqual([]);
    expect(early.telescopes[0]?.reason).toMatch(/^No observable window on BIG between 2027-03-10 15:00 UT and \d{4}-\d\d-\d\d \d\d:\d\d UT, when the target fades past CAM's limit V 21\.0\.$/);
  });

  it("accepts a window before the fade, cut at the fade, and keeps no window after it (so the director's queue shows none)", () => {
    const fadeAt = Date.parse(tonight!.start) + 2 * HOUR;
    const report = computeFeasibility(fadingTarget(fadeAt), [big], camera, NOW);
    const fade = fadeOf(report);
    expect(report.verdict).toBe("feasible");
    const first = report.telescopes[0]!.firstSlot!;
    expect(first.start).toBe(tonight!.start);
    expect(Date.parse(first.end)).toBeLessThanOrEqual(fade);
    expect(Date.parse(first.end)).toBeGreaterThan(fade - 2000);
    expect(report.telescopes[0]?.reason).toMatch(/^First window long enough on BIG: /);
    for (const w of windowsOf(report)) expect(Date.parse(w.end)).toBeLessThanOrEqual(fade);
    expect(Date.parse(report.horizon.end)).toBe(Math.floor(fade / 1000) * 1000);
    // The queue's "next window" reads the stored snapshot: past the fade there is none.
    const snapshot = toSnapshot(report);
    expect(nextWindowOf(snapshot, NOW.getTime(), 60)?.start).toBe(Date.parse(tonight!.start));
    expect(nextWindowOf(snapshot, fade - 30 * 60_000, 60)).toBeNull();
  });

  it("refuses on every telescope, plainly, a target already fainter than the limit at the start", () => {
    const rows = antiSolarEphemeris();
    const report = computeFeasibility(input({ kind: "ephemeris", ephemeris: rows, hMag: "26", gSlope: "" }), [big, small], camera, NOW);
    expect(report.fading?.alreadyFainter).toBe(true);
    const predicted = report.fading!.magnitudeAtStart!.toFixed(1);
    expect(Number(predicted)).toBeGreaterThan(21);
    expect(report.verdict).toBe("refused");
    expect(report.telescopes.map((t) => [t.verdict, t.reason])).toEqual([
      ["no_window", `The target is already fainter than CAM's limit V 21.0 (predicted V ${predicted}): no window on BIG can reach it.`],
      ["no_window", `The target is already fainter than CAM's limit V 21.0 (predicted V ${predicted}): no window on SML can reach it.`],
    ]);
    expect(report.reasons[0]).toBe(`The target is already fainter than CAM's limit V 21.0 (predicted V ${predicted}): no window on any acceptable telescope can reach it.`);
    expect(windowsOf(report)).toEqual([]);
    expect(report.telescopes.every((t) => t.firstSlot === null)).toBe(true);
  });

  it("changes nothing when the target fades only after the deadline", () => {
    const report = computeFeasibility(fadingTarget(NOW.getTime() + 80 * HOUR), [big], camera, NOW);
    expect(report.verdict).toBe("feasible");
    expect(windowsOf(report)).toEqual(windowsOf(sky));
    expect(report.horizon.end).toBe(sky.horizon.end);
  });

  it("charts every night a three-day window touches when it opens during a night", () => {
    const opensAtNight = new Date("2027-03-10T04:30:00Z"); // 01:30 in Chile: the night of the 9th is under way
    const request = feasibilityInputSchema.parse({
      ...input({ kind: "fixed", ...antiSolar }),
      earliestStart: opensAtNight.toISOString(),
      latestEnd: new Date(opensAtNight.getTime() + 72 * HOUR).toISOString(),
      deadline: new Date(opensAtNight.getTime() + 72 * HOUR).toISOString(),
      durationMinutes: "60",
    });
    const report = computeFeasibility(request, [big], null, opensAtNight);
    expect(report.skies[0]?.nights.map((n) => n.nightOf)).toEqual(["2027-03-09", "2027-03-10", "2027-03-11", "2027-03-12"]);
  });
});
