import { describe, expect, it } from "vitest";
import type { Role } from "@/db/types";
import { POST as EXECUTIONS } from "@/app/api/v1/blocks/[id]/executions/route";
import { POST as ACKNOWLEDGE } from "@/app/api/v1/telescopes/[id]/acknowledgements/route";
import { GET as QUEUE } from "@/app/api/v1/telescopes/[id]/queue/route";
import type { TonightQueue } from "@/lib/tonight/types";
import { makeToken } from "../fixtures";
import { addApprovedRequest, addBlock, addChange, call, makeNightDesk, SANTIAGO_SITE, userWithToken } from "./helpers";

const base = "http://localhost/api/v1";

async function scene() {
  const desk = await makeNightDesk(SANTIAGO_SITE);
  // Blocks well in the past so any outcome can be logged whatever today's date is.
  const requestId = await addApprovedRequest(desk, { name: "Fixture Flare 3", raDeg: 60, decDeg: -40 }, { start: "2026-04-03T20:00:00Z", end: "2026-04-04T10:00:00Z" });
  const tooBlock = await addBlock(desk, "2026-04-04T02:00:00Z", "2026-04-04T03:00:00Z", { kind: "too", tooRequestId: requestId });
  const changeId = await addChange(desk, { kind: "override", startsAt: "2099-01-01T00:00:00Z", endsAt: "2099-01-01T01:00:00Z", summary: "Override for Fixture Flare 3", blockId: tooBlock, requestId });
  const assistantToken = await makeToken(desk.assistant.id);
  return { desk, requestId, tooBlock, changeId, assistantToken };
}

const queueUrl = (ref: string, query = "") => `${base}/telescopes/${ref}/queue${query}`;

describe("GET /api/v1/telescopes/{id}/queue", () => {
  it.each<Role>(["night_assistant", "director", "observer", "admin"])("answers a %s", async (role) => {
    const s = await scene();
    const user = await userWithToken([role]);
    const r = await call(QUEUE, { url: queueUrl(s.desk.telescopeCode, "?night=2026-04-03"), token: user.token, params: { id: s.desk.telescopeCode } });
    expect(r.status).toBe(200);
    const queue = r.body as unknown as TonightQueue;
    expect(queue.blocks.map((b) => b.id)).toEqual([s.tooBlock]);
    // Only admins (and the telescope's own night assistants) may act on it.
    expect(queue.permissions.canAcknowledge).toBe(role === "admin");
  });

  it("refuses a PI, a missing token and a revoked one", async () => {
    const s = await scene();
    const pi = await userWithToken(["pi"]);
    expect((await call(QUEUE, { url: queueUrl(s.desk.telescopeCode), token: pi.token, params: { id: s.desk.telescopeCode } })).status).toBe(403);
    expect((await call(QUEUE, { url: queueUrl(s.desk.telescopeCode), params: { id: s.desk.telescopeCode } })).status).toBe(401);
    const revoked = await makeToken(s.desk.observer.id, { revoked: true });
    expect((await call(QUEUE, { url: queueUrl(s.desk.telescopeCode), token: revoked, params: { id: s.desk.telescopeCode } })).status).toBe(401);
  });

  it("finds the telescope by uuid or by code, defaults to tonight, and validates the night", async () => {
    const s = await scene();
    const byId = await call(QUEUE, { url: queueUrl(s.desk.telescopeId, "?night=2026-04-03"), token: s.assistantToken, params: { id: s.desk.telescopeId } });
    expect(byId.status).toBe(200);
    expect((byId.body as unknown as TonightQueue).permissions).toEqual({ canAcknowledge: true, canLog: true });
    const tonight = await call(QUEUE, { url: queueUrl(s.desk.telescopeCode), token: s.assistantToken, params: { id: s.desk.telescopeCode } });
    expect(tonight.status).toBe(200);
    expect((tonight.body as unknown as TonightQueue).night.nightOf).toMatch(/^\d{4}-\d{2}-\d{2}$/);
    expect((tonight.body as unknown as TonightQueue).changes.items.map((c) => c.id)).toEqual([s.changeId]);

    const bad = await call(QUEUE, { url: queueUrl(s.desk.telescopeCode, "?night=2026-02-30"), token: s.assistantToken, params: { id: s.desk.telescopeCode } });
    expect(bad.status).toBe(400);
    expect(bad.body).toMatchObject({ error: { code: "invalid_input", fields: { night: "That is not a calendar date." } } });
    const missing = await call(QUEUE, { url: queueUrl("NOPE"), token: s.assistantToken, params: { id: "NOPE" } });
    expect(missing.status).toBe(404);
  });
});

describe("POST /api/v1/telescopes/{id}/acknowledgements", () => {
  it("records the telescope's night assistant's acknowledgement, refuses others", async () => {
    const s = await scene();
    const url = `${base}/telescopes/${s.desk.telescopeCode}/acknowledgements`;
    const params = { id: s.desk.telescopeCode };
    for (const role of ["director", "observer", "pi"] as const) {
      const other = await userWithToken([role]);
      expect((await call(ACKNOWLEDGE, { url, method: "POST", token: other.token, params, body: { throughChangeId: s.changeId } })).status).toBe(403);
    }
    const stranger = await userWithToken(["night_assistant"]);
    const refused = await call(ACKNOWLEDGE, { url, method: "POST", token: stranger.token, params, body: { throughChangeId: s.changeId } });
    expect(refused.status).toBe(403);
    expect(refused.body).toMatchObject({ error: { code: "forbidden", message: `Only the night assistants of ${s.desk.telescopeCode} (and admins) acknowledge its changes.` } });

    const invalid = await call(ACKNOWLEDGE, { url, method: "POST", token: s.assistantToken, params, body: { throughChangeId: "all" } });
    expect(invalid.status).toBe(400);
    expect(Object.keys((invalid.body.error as { fields: object }).fields)).toEqual(["throughChangeId"]);

    const ok = await call(ACKNOWLEDGE, { url, method: "POST", token: s.assistantToken, params, body: { throughChangeId: s.changeId } });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ acknowledgement: { throughChangeId: s.changeId } });
    const after = await call(QUEUE, { url: queueUrl(s.desk.telescopeCode), token: s.assistantToken, params });
    expect((after.body as unknown as TonightQueue).changes.items).toEqual([]);

    const admin = await userWithToken(["admin"]);
    expect((await call(ACKNOWLEDGE, { url, method: "POST", token: admin.token, params, body: { throughChangeId: s.changeId } })).status).toBe(201);
  });
});

describe("POST /api/v1/blocks/{id}/executions", () => {
  it("logs an outcome for the telescope's night assistant and settles the ToO request", async () => {
    const s = await scene();
    const url = `${base}/blocks/${s.tooBlock}/executions`;
    const params = { id: s.tooBlock };
    const director = await userWithToken(["director"]);
    expect((await call(EXECUTIONS, { url, method: "POST", token: director.token, params, body: { outcome: "executed" } })).status).toBe(403);
    const stranger = await userWithToken(["night_assistant"]);
    expect((await call(EXECUTIONS, { url, method: "POST", token: stranger.token, params, body: { outcome: "executed" } })).status).toBe(403);

    const invalid = await call(EXECUTIONS, { url, method: "POST", token: s.assistantToken, params, body: { outcome: "partial" } });
    expect(invalid.status).toBe(400);
    expect(invalid.body).toMatchObject({ error: { fields: { minutesUsed: "Say how many minutes were observed." } } });
    const tooLong = await call(EXECUTIONS, { url, method: "POST", token: s.assistantToken, params, body: { outcome: "partial", minutesUsed: 61 } });
    expect(tooLong.status).toBe(400);
    expect(tooLong.body).toMatchObject({ error: { fields: { minutesUsed: "The block is 60 minutes long: at most 60 minutes can have been used." } } });

    const ok = await call(EXECUTIONS, { url, method: "POST", token: s.assistantToken, params, body: { outcome: "partial", minutesUsed: 35, note: "Clouds from 02:35" } });
    expect(ok.status).toBe(201);
    expect(ok.body).toMatchObject({ execution: { blockId: s.tooBlock, request: { id: s.requestId, from: "approved", to: "partially_executed" } } });

    const unknown = await call(EXECUTIONS, { url: `${base}/blocks/x/executions`, method: "POST", token: s.assistantToken, params: { id: "x" }, body: { outcome: "executed" } });
    expect(unknown.status).toBe(404);
    const gone = await call(EXECUTIONS, { url, method: "POST", token: s.assistantToken, params: { id: "00000000-0000-4000-8000-000000000000" }, body: { outcome: "executed" } });
    expect(gone.status).toBe(404);
  });
});
