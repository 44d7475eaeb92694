import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/v1/blocks/route";
import { DELETE, GET, PATCH } from "@/app/api/v1/blocks/[id]/route";
import { GET as SCHEDULE } from "@/app/api/v1/schedule/route";
import { getDb } from "@/db/index";
import { FINGERPRINT_REUSE_MS } from "@/lib/schedule/schedule-cache";
import { makeTelescopeAndProgram, makeToken, makeUser } from "./fixtures";

const base = "http://localhost/api/v1";

async function call<P>(handler: (r: Request, c: { params: Promise<P> }) => Promise<Response>, token: string, init: { url: string; method?: string; body?: unknown; params?: P }) {
  const response = await handler(
    new Request(init.url, { method: init.method ?? "GET", headers: { authorization: `Bearer ${token}` }, body: init.body === undefined ? undefined : JSON.stringify(init.body) }),
    { params: Promise.resolve((init.params ?? {}) as P) },
  );
  return { status: response.status, body: response.status === 204 ? null : ((await response.json()) as Record<string, unknown>) };
}

describe("the block API", () => {
  it("creates, moves and removes a block; an overlap is refused with a message naming the block in the way", async () => {
    const admin = await makeUser(["admin"]);
    const token = await makeToken(admin.id);
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    const first = await call(POST, token, { url: `${base}/blocks`, method: "POST", body: { telescopeId, programId, kind: "science", startsAt: "2027-02-10T01:00:00Z", endsAt: "2027-02-10T04:00:00Z" } });
    expect(first.status).toBe(201);
    const second = await call(POST, token, { url: `${base}/blocks`, method: "POST", body: { telescopeId, programId, kind: "engineering", startsAt: "2027-02-10T04:00:00Z", endsAt: "2027-02-10T06:00:00Z" } });
    expect(second.status).toBe(201);
    const secondId = String(second.body?.id);

    const clash = await call(PATCH, token, { url: `${base}/blocks/${secondId}`, method: "PATCH", params: { id: secondId }, body: { startsAt: "2027-02-10T03:00:00Z" } });
    expect(clash.status).toBe(409);
    expect(JSON.stringify(clash.body)).toMatch(/overlaps PRG\w+ on Scope \w+, 2027-02-10 01:00–04:00 UT\. Nothing was saved\./);

    // Nothing half-saved: the block is where it was.
    const unchanged = await call(GET, token, { url: `${base}/blocks/${secondId}`, params: { id: secondId } });
    expect((unchanged.body?.block as { startsAt: string }).startsAt).toBe("2027-02-10T04:00:00.000Z");

    const moved = await call(PATCH, token, { url: `${base}/blocks/${secondId}`, method: "PATCH", params: { id: secondId }, body: { startsAt: "2027-02-10T05:00:00Z", endsAt: "2027-02-10T07:00:00Z" } });
    expect(moved.status).toBe(200);
    const detail = moved.body?.block as { startsAt: string; history: Array<{ action: string }> };
    expect(detail.startsAt).toBe("2027-02-10T05:00:00.000Z");
    expect(detail.history.map((h) => h.action)).toEqual(["block.create", "block.update"]);

    const overlapNew = await call(POST, token, { url: `${base}/blocks`, method: "POST", body: { telescopeId, programId, kind: "science", startsAt: "2027-02-10T03:30:00Z", endsAt: "2027-02-10T05:30:00Z" } });
    expect(overlapNew.status).toBe(409);

    expect((await call(DELETE, token, { url: `${base}/blocks/${secondId}`, method: "DELETE", params: { id: secondId } })).status).toBe(204);
    expect((await call(GET, token, { url: `${base}/blocks/${secondId}`, params: { id: secondId } })).status).toBe(404);
  });

  it("refuses writes from non-admins and bad bodies with field messages", async () => {
    const observer = await makeUser(["observer"]);
    const admin = await makeUser(["admin"]);
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    const body = { telescopeId, programId, kind: "science", startsAt: "2027-02-11T01:00:00Z", endsAt: "2027-02-11T04:00:00Z" };
    expect((await call(POST, await makeToken(observer.id), { url: `${base}/blocks`, method: "POST", body })).status).toBe(403);
    const bad = await call(POST, await makeToken(admin.id), { url: `${base}/blocks`, method: "POST", body: { ...body, kind: "party", endsAt: "yesterday" } });
    expect(bad.status).toBe(400);
    expect(Object.keys((bad.body?.error as { fields: Record<string, string> }).fields).sort()).toEqual(["endsAt", "kind"]);
    const reversed = await call(POST, await makeToken(admin.id), { url: `${base}/blocks`, method: "POST", body: { ...body, endsAt: "2027-02-11T00:00:00Z" } });
    expect(reversed.status).toBe(400);
    expect((reversed.body?.error as { fields: Record<string, string> }).fields.endsAt).toBe("The end must come after the start.");
  });

  it("lists the schedule of a telescope in a range for any role, and validates the range", async () => {
    const observer = await makeUser(["observer"]);
    const admin = await makeUser(["admin"]);
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    await call(POST, await makeToken(admin.id), { url: `${base}/blocks`, method: "POST", body: { telescopeId, programId, kind: "science", startsAt: "2027-03-01T01:00:00Z", endsAt: "2027-03-01T04:00:00Z" } });
    const token = await makeToken(observer.id);
    const ok = await call(SCHEDULE, token, { url: `${base}/schedule?telescope=${telescopeId}&from=2027-03-01T00:00:00Z&to=2027-03-02T00:00:00Z` });
    expect(ok.status).toBe(200);
    expect((ok.body?.blocks as unknown[]).length).toBe(1);
    const bad = await call(SCHEDULE, token, { url: `${base}/schedule?telescope=${telescopeId}&from=2027-03-02T00:00:00Z&to=2027-03-01T00:00:00Z` });
    expect(bad.status).toBe(400);
  });

  it("never serves a stale schedule: a move or a removal shows in the next answer", async () => {
    const admin = await makeUser(["admin"]);
    const token = await makeToken(admin.id);
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    const url = `${base}/schedule?telescope=${telescopeId}&from=2027-03-05T00:00:00Z&to=2027-03-06T00:00:00Z`;
    const created = await call(POST, token, { url: `${base}/blocks`, method: "POST", body: { telescopeId, programId, kind: "science", startsAt: "2027-03-05T01:00:00Z", endsAt: "2027-03-05T03:00:00Z" } });
    const id = String(created.body?.id);
    const first = await call(SCHEDULE, token, { url });
    expect((first.body?.blocks as Array<{ startsAt: string }>).map((b) => b.startsAt)).toEqual(["2027-03-05T01:00:00.000Z"]);
    expect((await call(SCHEDULE, token, { url })).body).toEqual(first.body);
    await call(PATCH, token, { url: `${base}/blocks/${id}`, method: "PATCH", params: { id }, body: { startsAt: "2027-03-05T02:00:00Z", endsAt: "2027-03-05T04:00:00Z" } });
    const moved = await call(SCHEDULE, token, { url });
    expect((moved.body?.blocks as Array<{ startsAt: string }>).map((b) => b.startsAt)).toEqual(["2027-03-05T02:00:00.000Z"]);
    await call(DELETE, token, { url: `${base}/blocks/${id}`, method: "DELETE", params: { id } });
    expect((await call(SCHEDULE, token, { url })).body?.blocks).toEqual([]);
  });

  it("shows a write made elsewhere (another app instance, straight into the database) within a second", async () => {
    const admin = await makeUser(["admin"]);
    const token = await makeToken(admin.id);
    const { telescopeId, programId } = await makeTelescopeAndProgram();
    const url = `${base}/schedule?telescope=${telescopeId}&from=2027-03-07T00:00:00Z&to=2027-03-08T00:00:00Z`;
    expect((await call(SCHEDULE, token, { url })).body?.blocks).toEqual([]);
    await getDb()
      .insertInto("blocks")
      .values({ telescope_id: telescopeId, program_id: programId, kind: "science", starts_at: new Date("2027-03-07T01:00:00Z"), ends_at: new Date("2027-03-07T02:00:00Z") })
      .execute();
    await new Promise((resolve) => setTimeout(resolve, FINGERPRINT_REUSE_MS + 50));
    expect((await call(SCHEDULE, token, { url })).body?.blocks).toHaveLength(1);
  });
});
