// The visibility request: zod schema → field messages for a 400, and computeVisibility's
// JSON-ready answer.

import { describe, expect, it } from "vitest";
import {
  computeVisibility,
  parseVisibilityRequest,
  visibilityRequestSchema,
  zodErrorToFieldMessages,
} from "@/lib/visibility";

const body = {
  site: {
    name: "Southern site",
    latitudeDeg: -30.17,
    longitudeDeg: -70.8,
    heightM: 2200,
    timeZone: "America/Santiago",
  },
  telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 45, hourAngleHours: { min: -5, max: 5 } },
  target: { kind: "fixed", name: "test field", ra: "05h35m17.3s", dec: "-05 23 28" },
  constraints: { darkness: "nautical", maxAirmass: 2, minMoonSeparationDeg: 30 },
  when: { night: "2025-01-15" },
};

function fieldErrors(input: unknown): Record<string, string> {
  const parsed = parseVisibilityRequest(input);
  if (parsed.ok) throw new Error("expected the body to be rejected");
  return parsed.fieldErrors;
}

describe("visibility request schema", () => {
  it("accepts coordinates as typed text or as degrees, and fills defaults", () => {
    const parsed = parseVisibilityRequest(body);
    expect(parsed.ok).toBe(true);
    if (!parsed.ok) return;
    expect(parsed.data.target.kind).toBe("fixed");
    if (parsed.data.target.kind === "fixed") {
      expect(parsed.data.target.ra).toBeCloseTo(83.8221, 4);
      expect(parsed.data.target.dec).toBeCloseTo(-5.3911, 4);
    }
    expect(parsed.data.options).toEqual({ refraction: false, stepMinutes: 1, curveStepMinutes: 5 });
    const numeric = parseVisibilityRequest({ ...body, target: { kind: "fixed", ra: 83.8221, dec: -5.3911 } });
    expect(numeric.ok).toBe(true);
  });

  it("maps every problem to its field with a message that says what and where", () => {
    const errors = fieldErrors({
      ...body,
      site: { ...body.site, timeZone: "Mars/Olympus_Mons", latitudeDeg: 95 },
      target: { kind: "fixed", ra: "12:61:00", dec: "-91" },
      when: { from: "2025-02-30", to: "2025-01-01" },
    });
    expect(errors["site.timeZone"]).toMatch(/IANA time zone/);
    expect(errors["site.latitudeDeg"]).toBeDefined();
    expect(errors["target.ra"]).toBe('Right ascension "12:61:00": minutes must be less than 60 (at character 4).');
    expect(errors["target.dec"]).toMatch(/between −90° and \+90°.*character/);
    expect(errors["when.from"]).toMatch(/YYYY-MM-DD/);
  });

  it("checks the date range, the night choice and the telescope ranges", () => {
    expect(fieldErrors({ ...body, when: { from: "2025-02-01", to: "2025-01-01" } })["when.to"]).toMatch(/before/);
    expect(fieldErrors({ ...body, when: { from: "2025-01-01", to: "2026-06-01" } })["when.to"]).toMatch(/at most 366/);
    expect(fieldErrors({ ...body, when: {} })["when.from"]).toMatch(/night, or from and to/);
    expect(fieldErrors({ ...body, when: { night: "2025-01-01", from: "2025-01-01" } })["when.night"]).toMatch(
      /not both/,
    );
    expect(
      fieldErrors({ ...body, telescope: { ...body.telescope, hourAngleHours: { min: 3, max: -3 } } })[
        "telescope.hourAngleHours.max"
      ],
    ).toMatch(/less than max/);
    expect(
      fieldErrors({ ...body, telescope: { minAltitudeDeg: 30, maxAltitudeDeg: 20, sunAvoidanceDeg: 10 } })[
        "telescope.maxAltitudeDeg"
      ],
    ).toBeDefined();
  });

  it("checks ephemeris rows: order, all-or-none distances, what the fading clock needs", () => {
    const rows = [
      { time: "2026-08-16T00:00:00Z", ra: "20 10 00", dec: "-10 00 00", deltaAu: 0.01 },
      { time: "2026-08-15T23:00:00Z", ra: "20 11 00", dec: "-10 01 00" },
    ];
    const errors = fieldErrors({ ...body, target: { kind: "ephemeris", absoluteMagnitude: 21, rows } });
    expect(errors["target.rows.1.time"]).toMatch(/increase/);
    expect(errors["target.rows.1.deltaAu"]).toMatch(/every row or on none/);
    expect(errors["target.absoluteMagnitude"]).toMatch(/rAu and deltaAu/);
    expect(fieldErrors({ ...body, target: { kind: "comet" } })["target.kind"]).toBeDefined();
    expect(
      fieldErrors({ ...body, target: { kind: "ephemeris", rows: [{ time: "yesterday", ra: "1", dec: "2" }] } })[
        "target.rows.0.time"
      ],
    ).toMatch(/ISO 8601/);
  });

  it("a body that is not an object is one message on the empty path", () => {
    const result = visibilityRequestSchema.safeParse("hello");
    expect(result.success).toBe(false);
    if (!result.success) expect(Object.keys(zodErrorToFieldMessages(result.error))).toEqual([""]);
  });
});

describe("computeVisibility", () => {
  it("answers one night with windows, twilight, Moon, sun avoidance and an airmass curve", () => {
    const parsed = parseVisibilityRequest(body);
    if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
    const r = computeVisibility(parsed.data);
    const json = JSON.parse(JSON.stringify(r));
    expect(json).toEqual(r); // nothing lost in JSON (no NaN, no undefined, no Date)
    expect(r.nights).toHaveLength(1);
    const n = r.nights[0]!;
    expect(n.nightOf).toBe("2025-01-15");
    expect(n.windows.length).toBeGreaterThan(0);
    expect(n.windows[0]!.start.utc).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ$/);
    expect(n.windows[0]!.start.local).toMatch(/-03:00$/);
    expect(n.twilight.nauticalDusk).not.toBeNull();
    expect(n.sunAvoidance.status).toBe("clear");
    expect(n.bestAirmass!).toBeGreaterThanOrEqual(1);
    expect(r.curve!.points.length).toBeGreaterThan(100);
    expect(r.curve!.points.every((p) => p.airmass === null || p.airmass >= 1)).toBe(true);
    expect(r.curve!.points.every((p) => (p.airmass === null) === p.altitudeDeg! < 0)).toBe(true);
    expect(r.target.ra).toBe("05:35:17.30");
    expect(r.disclaimer).toMatch(/night assistant/);
  });

  it("refuses a target next to the Sun, with the reason", () => {
    const parsed = parseVisibilityRequest({ ...body, target: { kind: "fixed", ra: "19:55:00", dec: "-21:00:00" } });
    if (!parsed.ok) throw new Error("bad body");
    const r = computeVisibility(parsed.data);
    expect(r.sunAvoidance.status).toBe("refused");
    expect(r.sunAvoidance.reason).toMatch(/Refused for sun avoidance/);
    expect(r.nights[0]!.windows).toEqual([]);
  });

  it("answers a date range with per-night summaries and no curve", () => {
    const parsed = parseVisibilityRequest({ ...body, when: { from: "2025-01-10", to: "2025-01-16" } });
    if (!parsed.ok) throw new Error("bad body");
    const r = computeVisibility(parsed.data);
    expect(r.nights.map((n) => n.nightOf)).toEqual([
      "2025-01-10",
      "2025-01-11",
      "2025-01-12",
      "2025-01-13",
      "2025-01-14",
      "2025-01-15",
      "2025-01-16",
    ]);
    expect(r.curve).toBeNull();
    expect(r.summary.nights).toBe(7);
    expect(r.summary.observableMinutes).toBeCloseTo(
      r.nights.reduce((s, n) => s + n.observableMinutes, 0),
      0,
    );
  });

  it("runs the fading clock for an ephemeris target with H", () => {
    const start = Date.UTC(2026, 7, 15);
    const rows = Array.from({ length: 96 }, (_, i) => ({
      time: new Date(start + i * 3_600_000).toISOString(),
      ra: 300 + i * 0.05,
      dec: -20 + i * 0.02,
      rAu: 1.02 + i * 0.001,
      deltaAu: 0.02 + i * 0.0015,
    }));
    const request = (limitingMagnitude: number) => {
      const parsed = parseVisibilityRequest({
        ...body,
        target: { kind: "ephemeris", name: "invented object", absoluteMagnitude: 22, slopeG: 0.15, rows },
        instrument: { limitingMagnitude },
        when: { night: "2026-08-15" },
        constraints: { darkness: "nautical" },
      });
      if (!parsed.ok) throw new Error(JSON.stringify(parsed.fieldErrors));
      return computeVisibility(parsed.data);
    };
    const bright = request(35);
    expect(bright.fading!.reason).toMatch(/Stays brighter/);
    const first = bright.fading!.magnitudeAtStart!;
    const r = request(Math.round(first) + 1);
    expect(r.fading).not.toBeNull();
    expect(r.fading!.source).toBe("H-G");
    expect(r.fading!.fainterThanLimitAt).not.toBeNull();
    expect(r.fading!.reason).toMatch(/Fades past V = /);
    expect(request(first - 0.5).fading!.alreadyFainter).toBe(true);
    expect(r.target.kind).toBe("ephemeris");
    expect(r.nights[0]!.windows.length).toBeGreaterThan(0);
  });
});
