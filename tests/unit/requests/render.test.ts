// The request screens rendered on the server, as Next does before the browser takes over:
// the stable labels the browser journey relies on, the caution, and the charted night.
import { createElement as h } from "react";
import { renderToString } from "react-dom/server";
import { describe, expect, it, vi } from "vitest";
import { FeasibilityView } from "@/components/requests/feasibility-view";
import { RequestForm } from "@/components/requests/request-form";
import { RequestHistory } from "@/components/requests/request-history";
import { computeFeasibility } from "@/lib/requests/feasibility/compute";
import { emptyRequestForm } from "@/lib/requests/form-values";
import { feasibilityInputSchema } from "@/lib/requests/schemas";
import { formatRa, sunPosition } from "@/lib/sky";

vi.mock("next/navigation", () => ({ useRouter: () => ({ push: () => undefined, refresh: () => undefined }), usePathname: () => "/requests/new" }));

const NOW = new Date("2027-03-10T15:00:00Z");
const site = { id: "s", code: "S", name: "Southern site", latitudeDeg: -30, longitudeDeg: -70, heightM: 2000, timeZone: "America/Santiago" };
const scope = { id: "00000000-0000-4000-8000-000000000001", code: "AQ16", name: "Quebrada 1.6 m", minAltitudeDeg: 20, maxAirmass: 2.9, sunAvoidanceDeg: 30, hourAngleMinH: -6, hourAngleMaxH: 6, site };
const later = (hours: number) => new Date(NOW.getTime() + hours * 3_600_000).toISOString();

describe("request screens", () => {
  it("draw the feasibility with the caution, a chart of a night with windows, and the night table", () => {
    const ra = formatRa((sunPosition(NOW.getTime()).raDeg + 180) % 360);
    const input = feasibilityInputSchema.parse({
      target: { kind: "fixed", ra, dec: "-30" },
      telescopeIds: [scope.id],
      durationMinutes: 60,
      earliestStart: NOW.toISOString(),
      latestEnd: later(72),
      deadline: later(72),
      constraints: { darkness: "nautical" },
    });
    const html = renderToString(h(FeasibilityView, { report: computeFeasibility(input, [scope], null, NOW), targetName: "Comet X" }));
    expect(html).toContain("Planning aid only.");
    expect(html).toContain("Feasible: ");
    // 15:00 UT is the morning after the night of 03-09: the charts start with the night of 03-10.
    expect(html).toMatch(/aria-label="Airmass of Comet X from AQ16 on the night of 2027-03-10: observable \d\d:\d\d–\d\d:\d\d UT; limit 2\.90\."/);
    expect(html).toContain("Observable windows on AQ16, night by night");
  });

  it("draw the form with the labels people (and the browser journey) use", () => {
    const html = renderToString(
      h(RequestForm, {
        draftId: null,
        initial: emptyRequestForm(NOW, ["p1"]),
        programs: [{ id: "p1", code: "TOO-01", title: "Rapid photometry" }],
        telescopes: [{ id: scope.id, code: "AQ16", name: "Quebrada 1.6 m", siteName: "Southern site" }],
        instruments: [{ id: "i1", telescopeId: scope.id, telescopeCode: "AQ16", code: "PICO", name: "Pico fast-readout camera", limitingMagnitude: 21.9 }],
        attachments: [],
        saveDraft: async () => ({ ok: true as const, data: { id: "x", savedAt: NOW.toISOString() } }),
        submit: async () => ({ ok: false as const, message: "no" }),
      }),
    );
    for (const label of [
      "Program",
      "Target name",
      "Fixed coordinates",
      "Moving target (ephemeris)",
      "Right ascension (J2000)",
      "Declination (J2000)",
      "AQ16 — Quebrada 1.6 m",
      "AQ16 · PICO — Pico fast-readout camera (limit V 21.9)",
      "Time needed (minutes)",
      "Earliest start (UT)",
      "Latest end (UT)",
      "Deadline (UT)",
      "Maximum airmass",
      "Scientific justification",
      "Attachment kind",
      "Attach a file",
      "Submit request",
      "Drafts save as you type.",
    ]) {
      expect(html).toContain(label);
    }
    expect(html).toContain('aria-label="ToO request"');
    expect(html).toContain("Planning aid only.");
  });

  it("write the history as from → to, who and when", () => {
    const html = renderToString(h(RequestHistory, { events: [{ id: "1", at: NOW, actorName: "Ilona Marsh", fromState: "draft", toState: "submitted", note: "" }], timeZone: "America/Santiago" }));
    expect(html).toContain("Draft → Submitted");
    expect(html).toContain("Ilona Marsh");
  });
});
