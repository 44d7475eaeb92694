import { describe, expect, it } from "vitest";
import type { FeasibilitySnapshot } from "@/lib/requests/feasibility/types";
import { feasibilitySummary, nextWindowOf, orderQueue, type QueueRequest } from "@/lib/review/order";

const NOW = Date.parse("2027-01-10T12:00:00Z");
const h = (hours: number) => new Date(NOW + hours * 3_600_000).toISOString();

function snapshot(windows: Array<[number, number, number | null]>, code = "AQ41"): FeasibilitySnapshot {
  return {
    computedAt: h(-1),
    horizon: { start: h(-1), end: h(72) },
    durationMinutes: 60,
    verdict: "feasible",
    reasons: [],
    notes: [],
    disclaimer: "",
    fading: null,
    telescopes: [
      {
        telescopeId: "t",
        code,
        name: code,
        siteId: "s",
        siteName: "S",
        timeZone: "UTC",
        verdict: "feasible",
        reason: "",
        airmassLimit: 2,
        minAltitudeDeg: 30,
        sunAvoidanceDeg: 45,
        sunAvoidance: { status: "clear", reason: "" },
        longestWindowMinutes: 0,
        firstSlot: null,
        nights: [
          {
            nightOf: "2027-01-10",
            windows: windows.map(([s, e, a]) => ({ start: h(s), end: h(e), durationMinutes: (e - s) * 60, bestAirmass: a })),
            observableMinutes: 0,
            bestAirmass: null,
            moonIllumination: 0,
            moonClosestDeg: null,
            sunAvoidance: "clear",
            sunAvoidanceReason: "",
            notes: [],
          },
        ],
      },
    ],
  };
}

function request(id: string, over: Partial<QueueRequest>): QueueRequest {
  return { id, state: "submitted", targetName: id, piName: "PI", programCode: "TOO-01", urgency: "within_days", deadline: new Date(h(48)), submittedAt: new Date(h(-2)), durationMinutes: 60, telescopeCodes: ["AQ41"], feasibility: snapshot([[8, 14, 1.2]]), ...over };
}

describe("the review queue", () => {
  it("puts the most urgent first: tier, then deadline, then the sooner next window", () => {
    const order = orderQueue(
      [
        request("later-window", { feasibility: snapshot([[20, 26, 1.3]]) }),
        request("tonight", { urgency: "tonight", deadline: new Date(h(70)) }),
        request("earlier-deadline", { deadline: new Date(h(30)), feasibility: snapshot([[30, 36, 1.1]]) }),
        request("now", { urgency: "now", deadline: new Date(h(90)) }),
        request("sooner-window", {}),
      ],
      NOW,
    );
    expect(order.map((o) => o.id)).toEqual(["now", "tonight", "earlier-deadline", "sooner-window", "later-window"]);
  });

  it("finds the next window with room for the request, and says it in one line", () => {
    const s = snapshot([[-3, 0.5, 1.4], [2.25, 5, 1.234]]);
    // The first window has 30 min left: too short for an hour.
    const next = nextWindowOf(s, NOW, 60);
    expect(next).toMatchObject({ telescopeCode: "AQ41", start: Date.parse(h(2.25)) });
    expect(feasibilitySummary(s, next, NOW)).toBe("Next window on AQ41 in 2 h 15 min (2027-01-10 14:15 UT, best airmass 1.23).");
    const open = snapshot([[-1, 3, 1.5]]);
    expect(feasibilitySummary(open, nextWindowOf(open, NOW, 60), NOW)).toBe("Observable now on AQ41 until 15:00 UT, best airmass 1.50.");
    expect(feasibilitySummary(snapshot([[-5, -1, 1.5]]), null, NOW)).toBe("No observable window long enough is left before the deadline.");
    expect(feasibilitySummary(null, null, NOW)).toBe("Feasibility was not checked when the request was filed.");
  });

  it("ignores stored windows after the target fades past the instrument's limit, and says why none is left", () => {
    const fading = (at: string | null, alreadyFainter = false) => ({
      source: "H-G" as const,
      instrument: "CAM",
      limitingMagnitude: 21,
      magnitudeAtStart: 20,
      fainterThanLimitAt: at,
      alreadyFainter,
      coverageEnd: h(96),
      reason: "",
    });
    // Filed before windows were cut at the fade: the 20–26 h window is still stored.
    const s = { ...snapshot([[2, 2.5, 1.4], [20, 26, 1.2]]), fading: fading(h(21)) };
    expect(nextWindowOf(s, NOW, 60)).toMatchObject({ start: Date.parse(h(20)), end: Date.parse(h(21)) });
    expect(nextWindowOf(s, NOW, 90)).toBeNull();
    const later = NOW + 22 * 3_600_000;
    expect(feasibilitySummary(s, nextWindowOf(s, later, 60), later)).toBe("The target has faded past the instrument's limit (predicted at 2027-01-11 09:00 UT).");
    const faint = { ...snapshot([[2, 6, 1.2]]), fading: fading(null, true) };
    expect(nextWindowOf(faint, NOW, 60)).toBeNull();
    expect(feasibilitySummary(faint, null, NOW)).toBe("The target was already fainter than the instrument's limit when the request was filed.");
  });
});
