import { OpenApiGeneratorV31, OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { describe, expect, it } from "vitest";
import { registerSecurity } from "@/lib/openapi/common";
import { altitudeForAirmass, fixedTargetPosition, localSiderealTime, normalizeDegrees } from "@/lib/sky";
import { blockState } from "@/lib/tonight/block-state";
import { nightAt } from "@/lib/tonight/night";
import { onSkyFigures } from "@/lib/tonight/on-sky";
import { registerTonightPaths } from "@/lib/tonight/openapi";
import { summarise } from "@/lib/tonight/summary";

const site = { latitudeDeg: -30.52, longitudeDeg: -70.41, heightM: 2310, timeZone: "America/Santiago" };

describe("block states", () => {
  const block = { startsAt: new Date("2027-04-04T02:00:00Z"), endsAt: new Date("2027-04-04T03:00:00Z") };
  it("follow the clock on half-open intervals when nothing is logged", () => {
    expect(blockState(block, new Date("2027-04-04T01:59:59Z"), null)).toBe("upcoming");
    expect(blockState(block, new Date("2027-04-04T02:00:00Z"), null)).toBe("on_sky");
    expect(blockState(block, new Date("2027-04-04T03:00:00Z"), null)).toBe("done");
  });
  it("follow the log when there is one", () => {
    expect(blockState(block, new Date("2027-04-04T02:30:00Z"), "weather")).toBe("aborted");
    expect(blockState(block, new Date("2027-04-04T02:30:00Z"), "partial")).toBe("done");
    expect(blockState(block, new Date("2027-04-04T01:00:00Z"), "technical")).toBe("aborted");
  });
});

describe("justification summaries", () => {
  it("keep a short first paragraph whole and cut a long one at a word", () => {
    expect(summarise("Short case.\n\nDetails follow.")).toBe("Short case.");
    const long = summarise("word ".repeat(100), 40);
    expect(long.endsWith("word…")).toBe(true);
    expect(long.length).toBeLessThanOrEqual(41);
  });
});

describe("live figures for the block on sky", () => {
  const night = nightAt(site, "2027-04-03");
  const telescope = { maxAirmass: 2.4, minAltitudeDeg: 20 };

  it("find the airmass limit crossing of a setting target to within a minute (checked by brute force)", () => {
    const now = Date.parse("2027-04-04T03:00:00Z");
    const raDeg = normalizeDegrees(localSiderealTime(now, site.longitudeDeg) - 30);
    const f = onSkyFigures({ target: { kind: "fixed", raDeg, decDeg: -10 }, site, telescope, dawn: Date.parse(night.nauticalDawn ?? ""), nightEnd: Date.parse(night.end), now });
    expect(f?.limit).toBe("airmass");
    const limitAlt = altitudeForAirmass(2.4);
    let t = now;
    while (fixedTargetPosition(raDeg, -10, site, t).altitudeDeg >= limitAlt) t += 15_000;
    expect(Math.abs(Date.parse(f?.until ?? "") - t)).toBeLessThan(60_000);
    expect(f?.airmass).toBeCloseTo(fixedTargetPosition(raDeg, -10, site, now).airmass ?? NaN, 6);
  });

  it("use the altitude limit when it is the stricter one, and say when the target is already past it", () => {
    const now = Date.parse("2027-04-04T03:00:00Z");
    const raDeg = normalizeDegrees(localSiderealTime(now, site.longitudeDeg) - 80);
    const strict = { maxAirmass: 3, minAltitudeDeg: 40 };
    const f = onSkyFigures({ target: { kind: "fixed", raDeg, decDeg: -30 }, site, telescope: strict, dawn: null, nightEnd: Date.parse(night.end), now });
    expect(f).toMatchObject({ limit: "altitude", beyondLimitNow: true, minutesLeft: 0 });
  });

  it("stop at dawn for a target that stays up", () => {
    const now = Date.parse("2027-04-04T09:00:00Z");
    const raDeg = normalizeDegrees(localSiderealTime(now, site.longitudeDeg));
    const dawn = Date.parse(night.nauticalDawn ?? "");
    const f = onSkyFigures({ target: { kind: "fixed", raDeg, decDeg: -30 }, site, telescope, dawn, nightEnd: Date.parse(night.end), now });
    expect(f).toMatchObject({ limit: "dawn", until: new Date(dawn).toISOString(), minutesLeft: Math.floor((dawn - now) / 60_000) });
  });
});

describe("the OpenAPI description", () => {
  it("generates for the three routes", () => {
    const registry = new OpenAPIRegistry();
    registerSecurity(registry);
    registerTonightPaths(registry);
    const doc = new OpenApiGeneratorV31(registry.definitions).generateDocument({ openapi: "3.1.0", info: { title: "t", version: "1" } });
    expect(Object.keys(doc.paths ?? {}).sort()).toEqual(["/api/v1/blocks/{id}/executions", "/api/v1/telescopes/{id}/acknowledgements", "/api/v1/telescopes/{id}/queue"]);
  });
});
