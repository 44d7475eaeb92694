import ICAL from "ical.js";
import { describe, expect, it } from "vitest";
import { GET } from "@/app/api/v1/schedule/export/route";
import { getDb } from "@/db/index";
import { importFile } from "@/lib/schedule/import/service";
import { makeToken, makeUser } from "../fixtures";
import { blocksOn, makeImportWorld, type ImportWorld } from "./world";

const noParams = { params: Promise.resolve({}) };
const HEADER = "telescope,program,observer_email,instrument,kind,start,end,time_zone,notes";

function get(query: string, token?: string) {
  return GET(new Request(`http://localhost/api/v1/schedule/export?${query}`, { headers: token ? { authorization: `Bearer ${token}` } : {} }), noParams);
}

async function seed(w: ImportWorld) {
  const admin = await makeUser(["admin"]);
  const t = w.telescope.code;
  const text = [
    HEADER,
    // Madrid, the night of the March change: 21:00 CET to 06:30 CEST.
    `${t},${w.science.code},${w.observer.email},${w.instrument.code},,2027-03-27 21:00,2027-03-28 06:30,Europe/Madrid,"a note, with =signs"`,
    `${t},${w.engineering.code},,,,2027-03-28T20:00:00Z,2027-03-29T04:00:00Z,,`,
    `${t},${w.science.code},,,payback,2027-10-30T19:00:00Z,2027-10-31T05:00:00Z,,`,
  ].join("\n");
  await importFile(getDb(), admin.id, "seed.csv", text);
  return blocksOn(w.telescope.id);
}

describe("GET /api/v1/schedule/export", () => {
  it("answers 401 signed out and 400 with a message per bad field", async () => {
    expect((await get("format=ics")).status).toBe(401);
    const user = await makeUser(["observer"]);
    const response = await get("format=xml&telescope=abc&from=yesterday", await makeToken(user.id));
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(body.error.fields).sort()).toEqual(["format", "from", "telescope"]);
    expect(body.error.fields.telescope).toBe("Unknown telescope.");
  });

  it("exports iCalendar that ical.js reads back with identical instants, one event per block", async () => {
    const w = await makeImportWorld("Europe/Madrid");
    const blocks = await seed(w);
    const user = await makeUser(["night_assistant"]);
    const response = await get(`format=ics&telescope=${w.telescope.id}`, await makeToken(user.id));
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/calendar; charset=utf-8");
    const calendar = new ICAL.Component(ICAL.parse(await response.text()));
    const events = calendar.getAllSubcomponents("vevent").map((c) => new ICAL.Event(c));
    expect(events.map((e) => [e.uid, e.startDate.toJSDate().toISOString(), e.endDate.toJSDate().toISOString()])).toEqual(
      blocks.map((b) => [b.id, b.starts_at.toISOString(), b.ends_at.toISOString()]),
    );
    expect(events[0]?.summary).toBe(`${w.science.code} · science`);
    expect(events[0]?.location).toContain(w.telescope.code);
    expect(events[0]?.description).toContain(`Observer: Fixture ${w.observer.email} <${w.observer.email}>`);
    expect(events[0]?.description).toContain(`Instrument: ${w.instrument.code} — Imager`);
  });

  it("exports CSV that imports again to the same blocks", async () => {
    const w = await makeImportWorld("Europe/Madrid");
    const before = await seed(w);
    const user = await makeUser(["pi"]);
    const response = await get(`format=csv&telescope=${w.telescope.id}&from=2027-01-01T00:00:00Z&to=2028-01-01T00:00:00Z`, await makeToken(user.id));
    expect(response.headers.get("content-disposition")).toBe('attachment; filename="nightbreak-schedule.csv"');
    const csv = await response.text();
    expect(csv).toContain("2027-03-27T21:00:00+01:00,2027-03-28T06:30:00+02:00,Europe/Madrid");

    await getDb().deleteFrom("blocks").where("telescope_id", "=", w.telescope.id).execute();
    const admin = await makeUser(["admin"]);
    await importFile(getDb(), admin.id, "export.csv", csv);
    const after = await blocksOn(w.telescope.id);
    const shape = (b: (typeof before)[number]) => [b.starts_at.toISOString(), b.ends_at.toISOString(), b.kind, b.program_id, b.observer_user_id, b.instrument_id, b.notes];
    expect(after.map(shape)).toEqual(before.map(shape));
  });

  it("filters by observer and by time window", async () => {
    const w = await makeImportWorld("Europe/Madrid");
    const blocks = await seed(w);
    const token = await makeToken((await makeUser(["observer"])).id);
    const mine = await (await get(`format=csv&observer=${w.observer.id}`, token)).text();
    expect(mine.trim().split("\r\n")).toHaveLength(2);
    const october = await (await get(`format=ics&telescope=${w.telescope.id}&from=2027-10-01T00:00:00Z&to=2027-11-01T00:00:00Z`, token)).text();
    const uids = new ICAL.Component(ICAL.parse(october)).getAllSubcomponents("vevent").map((c) => c.getFirstPropertyValue("uid"));
    expect(uids).toEqual([blocks[2]?.id]);
  });
});
