// The PI's to-do list on the home page, rendered on the server: the director's note with
// a link to edit the request, drafts, and each override in UT with the site's local time.
import { createElement as h } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { PiAttentionList } from "@/components/home/pi-attention";
import type { PiAttention } from "@/lib/requests/attention";

const NOW = new Date("2026-12-01T23:00:00Z");
const NOTHING: PiAttention = { returned: [], drafts: [], overrides: [] };

const render = (attention: PiAttention) => renderToStaticMarkup(h(PiAttentionList, { attention, now: NOW }));
const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/\s+/g, " ");

describe("the PI's home list", () => {
  it("says so when nothing needs the PI", () => {
    expect(text(render(NOTHING))).toContain("No override requests need your attention.");
  });

  it("quotes the director's note of a returned request and links to edit it", () => {
    const html = render({
      ...NOTHING,
      returned: [
        { id: "r1", targetName: "NBX-7", programCode: "CON-TOO-02", note: "Attach the finding chart.", returnedBy: "Tomasz Okafor-Lind", returnedAt: new Date("2026-12-01T22:31:00Z"), timeZone: "America/Santiago" },
      ],
    });
    expect(html).toContain('href="/requests/r1"');
    expect(text(html)).toContain("Returned to you for changes");
    expect(text(html)).toContain("Attach the finding chart.");
    expect(text(html)).toContain("returned by Tomasz Okafor-Lind 2026-12-01 22:31 UT · 2026-12-01 19:31 GMT-3");
    expect(text(html)).toContain("Edit and file it again");
    expect(text(html)).not.toContain("No override requests need your attention.");
  });

  it("lists drafts, a few at a time, with a way to all of them", () => {
    const drafts = Array.from({ length: 7 }, (_, i) => ({ id: `d${i}`, targetName: i ? `Draft ${i}` : "", programCode: null, updatedAt: new Date("2026-12-01T20:00:00Z") }));
    const html = render({ ...NOTHING, drafts });
    expect(text(html)).toContain("Drafts not yet filed");
    expect(text(html)).toContain("Untitled draft");
    expect(text(html)).toContain("last edited 2026-12-01 20:00 UT");
    expect(html).toContain('href="/requests/d4"');
    expect(html).not.toContain('href="/requests/d5"');
    expect(text(html)).toContain("and 2 more: see all your requests");
  });

  it("shows each override's telescope and times in UT and local time, and marks one under way", () => {
    const site = { name: "Alto Quebrada Station", timeZone: "America/Santiago" };
    const telescope = { code: "AQ41", name: "Quebrada 4.1 m" };
    const html = render({
      ...NOTHING,
      overrides: [
        { requestId: "o1", targetName: "NBX-7", programCode: "CON-TOO-02", telescope, site, startsAt: new Date("2026-12-01T22:45:00Z"), endsAt: new Date("2026-12-02T00:15:00Z") },
        { requestId: "o2", targetName: "NBX-8", programCode: "CON-TOO-02", telescope, site, startsAt: new Date("2026-12-02T02:10:00Z"), endsAt: new Date("2026-12-02T03:40:00Z") },
      ],
    });
    const t = text(html);
    expect(t).toContain("Your approved overrides");
    expect(t).toContain("Quebrada 4.1 m AQ41");
    // UT and the site's local time side by side (TimeRange draws the pair; its own tests cover the format).
    expect(html).toContain('<time dateTime="2026-12-02T02:10:00.000Z">2026-12-02 02:10</time>');
    expect(t).toContain("2026-12-01 23:10");
    expect(t.match(/under way/g)).toHaveLength(1);
    expect(t.indexOf("NBX-7")).toBeLessThan(t.indexOf("under way"));
    expect(t.indexOf("under way")).toBeLessThan(t.indexOf("NBX-8"));
    expect(html).toContain('href="/requests/o2"');
  });
});
