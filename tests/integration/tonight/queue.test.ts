import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { altitudeForAirmass, fixedTargetPosition, localSiderealTime, normalizeDegrees } from "@/lib/sky";
import { formatLocal } from "@/lib/time/format";
import { getTonightQueue } from "@/lib/tonight/queue";
import { addApprovedMovingRequest, addApprovedRequest, addAttachment, addBlock, addExecution, makeNightDesk, MADRID_SITE, SANTIAGO_SITE } from "./helpers";

describe("tonight's queue: the night and its order", () => {
  it("covers one night at Madrid across the spring-forward change, in UT order, and leaves out the nights either side", async () => {
    const desk = await makeNightDesk(MADRID_SITE);
    // Inserted out of order on purpose; 2027-03-28 01:00 UT is when Madrid jumps from 02:00 CET to 03:00 CEST.
    const late = await addBlock(desk, "2027-03-28T01:00:00Z", "2027-03-28T04:30:00Z");
    const early = await addBlock(desk, "2027-03-27T19:30:00Z", "2027-03-28T00:30:00Z");
    const acrossJump = await addBlock(desk, "2027-03-28T00:30:00Z", "2027-03-28T01:00:00Z");
    await addBlock(desk, "2027-03-27T09:00:00Z", "2027-03-27T11:00:00Z"); // the night before (ends before local mean noon)
    await addBlock(desk, "2027-03-28T19:30:00Z", "2027-03-28T23:00:00Z"); // the night after

    const viewer = { id: desk.assistant.id, roles: ["night_assistant" as const] };
    const queue = await getTonightQueue(getDb(), viewer, desk.telescopeCode, "2027-03-27", new Date("2027-03-27T15:00:00Z"));

    expect(queue.night.nightOf).toBe("2027-03-27");
    expect(queue.blocks.map((b) => b.id)).toEqual([early, acrossJump, late]);
    // The local day is 23 hours long, the night span is still exactly 24 hours of UT.
    expect(Date.parse(queue.night.end) - Date.parse(queue.night.start)).toBe(86_400_000);
    // Sunset, twilight and sunrise in order, all inside the span.
    const events = [queue.night.sunset, queue.night.civilDusk, queue.night.nauticalDusk, queue.night.astronomicalDusk, queue.night.astronomicalDawn, queue.night.nauticalDawn, queue.night.civilDawn, queue.night.sunrise];
    const times = events.map((e) => Date.parse(e ?? ""));
    expect(times.every((t) => t > Date.parse(queue.night.start) && t < Date.parse(queue.night.end))).toBe(true);
    expect([...times].sort((a, b) => a - b)).toEqual(times);
    // Sunset in CET, sunrise in CEST: the clock labels move, the instants do not.
    expect(formatLocal(new Date(queue.night.sunset ?? ""), MADRID_SITE.timeZone)).toMatch(/^2027-03-27 19:\d\d (GMT\+1|CET)$/);
    expect(formatLocal(new Date(queue.night.sunrise ?? ""), MADRID_SITE.timeZone)).toMatch(/^2027-03-28 08:\d\d (GMT\+2|CEST)$/);
    expect(queue.night.bands.map((b) => b.level)).toEqual(["sunset", "civil", "nautical", "astronomical"]);
    expect(queue.blocks.every((b) => b.state === "upcoming")).toBe(true);
  });

  it("orders a Santiago night by UT when the clocks fall back and local times repeat", async () => {
    const desk = await makeNightDesk(SANTIAGO_SITE);
    // 2027-04-04 03:00 UT: Santiago goes from 24:00 (UTC−3) back to 23:00 (UTC−4).
    const second = await addBlock(desk, "2027-04-04T02:30:00Z", "2027-04-04T03:00:00Z"); // 23:30–24:00 −03
    const third = await addBlock(desk, "2027-04-04T03:00:00Z", "2027-04-04T06:00:00Z"); // 23:00–02:00 −04
    const first = await addBlock(desk, "2027-04-03T23:30:00Z", "2027-04-04T02:30:00Z");
    const viewer = { id: desk.observer.id, roles: ["observer" as const] };

    const queue = await getTonightQueue(getDb(), viewer, desk.telescopeCode.toLowerCase(), "2027-04-03", new Date("2027-04-04T02:45:00Z"));
    expect(queue.blocks.map((b) => b.id)).toEqual([first, second, third]);
    // Sorting by local wall-clock time would put the third block before the second.
    const local = queue.blocks.map((b) => formatLocal(new Date(b.startsAt), SANTIAGO_SITE.timeZone).slice(11, 16));
    expect(local).toEqual(["20:30", "23:30", "23:00"]);
    expect(queue.blocks.map((b) => b.state)).toEqual(["done", "on_sky", "upcoming"]);
    expect(queue.telescope.timeZone).toBe("America/Santiago");

    // The next night holds none of them.
    const next = await getTonightQueue(getDb(), viewer, desk.telescopeId, "2027-04-04", new Date("2027-04-04T02:45:00Z"));
    expect(next.blocks).toEqual([]);
  });

  it("names tonight by the local date on which the night began when no night is given", async () => {
    const desk = await makeNightDesk(MADRID_SITE);
    const viewer = { id: desk.observer.id, roles: ["observer" as const] };
    const beforeNoon = await getTonightQueue(getDb(), viewer, desk.telescopeCode, undefined, new Date("2027-03-28T03:00:00Z"));
    expect(beforeNoon.night.nightOf).toBe("2027-03-27");
    const afternoon = await getTonightQueue(getDb(), viewer, desk.telescopeCode, undefined, new Date("2027-03-28T13:00:00Z"));
    expect(afternoon.night.nightOf).toBe("2027-03-28");
  });

  it("gives states from the clock and the night log", async () => {
    const desk = await makeNightDesk(SANTIAGO_SITE);
    const aborted = await addBlock(desk, "2027-04-03T23:30:00Z", "2027-04-04T01:00:00Z");
    const executed = await addBlock(desk, "2027-04-04T01:00:00Z", "2027-04-04T02:00:00Z");
    const cutShort = await addBlock(desk, "2027-04-04T02:00:00Z", "2027-04-04T04:00:00Z");
    await addExecution(aborted, "weather", desk.assistant.id);
    await addExecution(executed, "executed", desk.assistant.id);
    await addExecution(cutShort, "technical", desk.assistant.id); // logged while its slot still runs
    const viewer = { id: desk.assistant.id, roles: ["night_assistant" as const] };
    const queue = await getTonightQueue(getDb(), viewer, desk.telescopeCode, "2027-04-03", new Date("2027-04-04T03:00:00Z"));
    expect(queue.blocks.map((b) => [b.state, b.execution?.outcome])).toEqual([
      ["aborted", "weather"],
      ["done", "executed"],
      ["aborted", "technical"],
    ]);
    expect(queue.blocks[0]?.execution?.loggedByName).toMatch(/^Fixture /);
  });

  it("shows a ToO block with its target, justification, attachments and live figures while on sky", async () => {
    const desk = await makeNightDesk(SANTIAGO_SITE);
    const now = new Date("2027-04-04T04:00:00Z");
    // A target an hour and a half west of the meridian: it is setting towards the airmass limit.
    const raDeg = normalizeDegrees(localSiderealTime(now.getTime(), SANTIAGO_SITE.longitudeDeg) - 22.5);
    const justification = `${"Colours are needed before the fade. ".repeat(12)}\n\nSecond paragraph with details.`;
    const requestId = await addApprovedRequest(desk, { name: "Fixture Transient 27a", raDeg, decDeg: -30, justification }, { start: "2027-04-03T20:00:00Z", end: "2027-04-04T12:00:00Z" });
    await addAttachment(requestId, desk.pi.id, "justification", "case.pdf");
    await addAttachment(requestId, desk.pi.id, "finding_chart", "chart.png");
    const tooBlock = await addBlock(desk, "2027-04-04T03:30:00Z", "2027-04-04T05:00:00Z", { kind: "too", tooRequestId: requestId });
    await addBlock(desk, "2027-04-04T05:00:00Z", "2027-04-04T07:00:00Z");

    const viewer = { id: desk.assistant.id, roles: ["night_assistant" as const] };
    const queue = await getTonightQueue(getDb(), viewer, desk.telescopeCode, "2027-04-03", now);
    const block = queue.blocks.find((b) => b.id === tooBlock);
    expect(block?.state).toBe("on_sky");
    expect(block?.too).toMatchObject({ requestId, requestState: "approved", targetName: "Fixture Transient 27a", target: { kind: "fixed", decDeg: -30 } });
    expect(block?.too?.target.raDeg).toBeCloseTo(raDeg, 6);
    expect(block?.too?.justificationSummary.length).toBeLessThanOrEqual(241);
    expect(block?.too?.justificationSummary.endsWith("…")).toBe(true);
    expect(block?.too?.justification).toBe(justification);
    expect(block?.too?.attachments.map((a) => a.fileName)).toEqual(["chart.png", "case.pdf"]);

    const onSky = block?.onSky;
    expect(onSky).not.toBeNull();
    const site = { latitudeDeg: SANTIAGO_SITE.latitudeDeg, longitudeDeg: SANTIAGO_SITE.longitudeDeg, heightM: 2000 };
    const here = fixedTargetPosition(raDeg, -30, site, now.getTime());
    expect(onSky?.altitudeDeg).toBeCloseTo(here.altitudeDeg, 2);
    expect(onSky?.airmass).toBeCloseTo(here.airmass ?? NaN, 3);
    expect(onSky?.limit).toBe("airmass");
    expect(onSky?.beyondLimitNow).toBe(false);
    const until = Date.parse(onSky?.until ?? "");
    expect(until).toBeLessThan(Date.parse(queue.night.nauticalDawn ?? ""));
    // At the reported instant the target is at the telescope's airmass limit (2.5).
    expect(fixedTargetPosition(raDeg, -30, site, until).altitudeDeg).toBeCloseTo(altitudeForAirmass(2.5), 1);
    expect(onSky?.minutesLeft).toBe(Math.floor((until - now.getTime()) / 60_000));

    // Blocks not on sky carry no live figures.
    expect(queue.blocks.filter((b) => b.id !== tooBlock).every((b) => b.onSky === null)).toBe(true);
  });

  it("counts down to dawn for a target that stays high", async () => {
    const desk = await makeNightDesk(SANTIAGO_SITE);
    const now = new Date("2027-04-04T08:30:00Z");
    const raDeg = normalizeDegrees(localSiderealTime(now.getTime(), SANTIAGO_SITE.longitudeDeg) + 15);
    const requestId = await addApprovedRequest(desk, { name: "Fixture High Target", raDeg, decDeg: -30 }, { start: "2027-04-03T20:00:00Z", end: "2027-04-04T12:00:00Z" });
    await addBlock(desk, "2027-04-04T08:00:00Z", "2027-04-04T10:00:00Z", { kind: "too", tooRequestId: requestId });
    const queue = await getTonightQueue(getDb(), { id: desk.assistant.id, roles: ["night_assistant"] }, desk.telescopeCode, "2027-04-03", now);
    const onSky = queue.blocks[0]?.onSky;
    expect(onSky?.limit).toBe("dawn");
    // The request asks for nautical darkness: its dawn ends the observation.
    expect(onSky?.until).toBe(queue.night.nauticalDawn);
  });

  it("follows a moving target along its ephemeris, sending only the rows near the night", async () => {
    const desk = await makeNightDesk(SANTIAGO_SITE);
    const now = new Date("2027-04-04T05:00:00Z");
    const base = normalizeDegrees(localSiderealTime(now.getTime(), SANTIAGO_SITE.longitudeDeg) - 10);
    const t0 = Date.parse("2027-03-20T00:00:00Z");
    // Every six hours for a month, moving 2° a day in RA; the position at `now` is known exactly.
    const rows = Array.from({ length: 120 }, (_, i) => {
      const t = t0 + i * 6 * 3_600_000;
      return { time: new Date(t).toISOString(), ra: normalizeDegrees(base + (2 * (t - now.getTime())) / 86_400_000), dec: -20 };
    });
    const requestId = await addApprovedMovingRequest(desk, "Fixture Moving Body", rows, { start: "2027-04-03T20:00:00Z", end: "2027-04-04T12:00:00Z" });
    await addBlock(desk, "2027-04-04T04:30:00Z", "2027-04-04T06:00:00Z", { kind: "too", tooRequestId: requestId });
    const queue = await getTonightQueue(getDb(), { id: desk.assistant.id, roles: ["night_assistant"] }, desk.telescopeCode, "2027-04-03", now);
    const block = queue.blocks[0];
    expect(block?.too?.target).toMatchObject({ kind: "ephemeris", ephemerisRows: 120 });
    expect(block?.too?.target.raDeg).toBeCloseTo(base, 2);
    expect(block?.too?.target.decDeg).toBeCloseTo(-20, 4);
    const site = { latitudeDeg: SANTIAGO_SITE.latitudeDeg, longitudeDeg: SANTIAGO_SITE.longitudeDeg, heightM: 2000 };
    expect(block?.onSky?.altitudeDeg).toBeCloseTo(fixedTargetPosition(base, -20, site, now.getTime()).altitudeDeg, 1);
    expect(block?.onSky?.minutesLeft).toBeGreaterThan(0);
  });

  it("refuses a telescope that does not exist", async () => {
    const desk = await makeNightDesk(SANTIAGO_SITE);
    await expect(getTonightQueue(getDb(), { id: desk.observer.id, roles: ["observer"] }, "NO-SUCH-SCOPE", undefined)).rejects.toThrow(/no telescope "NO-SUCH-SCOPE"/);
  });
});
