// The machine API, called through its route handlers with bearer tokens: filing with an
// Idempotency-Key, reading, withdrawing, validation messages, revoked tokens, and who may
// see what. The sky is the real one at the time the tests run, so targets are chosen
// relative to the Sun's current place.
import { afterAll, describe, expect, it } from "vitest";
import { POST as fileRoute } from "@/app/api/v1/too-requests/route";
import { GET as readRoute } from "@/app/api/v1/too-requests/[id]/route";
import { POST as withdrawRoute } from "@/app/api/v1/too-requests/[id]/withdraw/route";
import { POST as feasibilityRoute } from "@/app/api/v1/too-requests/feasibility/route";
import { POST as visibilityRoute } from "@/app/api/v1/visibility/route";
import { getDb } from "@/db/index";
import { closeNoticeQueue } from "@/lib/notices/queue";
import type { ApiRequest } from "@/lib/requests/api-shape";
import { makeToken, makeUser } from "../fixtures";
import { antiSolar, atTheSun, makeRequestWorld, requestBody } from "./fixtures";

const BASE = "http://localhost/api/v1/too-requests";
type ErrorBody = { error: { code: string; message: string; fields?: Record<string, string> } };

type Handler<P> = (r: Request, c: { params: Promise<P> }) => Promise<Response>;

function call<P extends Record<string, string>>(handler: Handler<P>, url: string, init: { token?: string; body?: unknown; key?: string; params?: P; method?: string }) {
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (init.token) headers.authorization = `Bearer ${init.token}`;
  if (init.key) headers["idempotency-key"] = init.key;
  const request = new Request(url, { method: init.method ?? "POST", headers, body: init.body === undefined ? undefined : JSON.stringify(init.body) });
  return handler(request, { params: Promise.resolve(init.params ?? ({} as P)) });
}

const file = (token: string, body: unknown, key?: string) => call(fileRoute, BASE, { token, body, key });
const read = (token: string, id: string) => call(readRoute, `${BASE}/${id}`, { token, params: { id }, method: "GET" });

async function countRequests(piId: string): Promise<number> {
  const rows = await getDb().selectFrom("too_requests").select("id").where("pi_user_id", "=", piId).execute();
  return rows.length;
}

afterAll(async () => {
  await closeNoticeQueue();
});

describe("POST /api/v1/too-requests", () => {
  it("files a request for a PI token and reads it back with its history", async () => {
    const world = await makeRequestWorld();
    const response = await file(world.piToken, requestBody(world, new Date(), antiSolar(new Date())));
    expect(response.status).toBe(201);
    const { request } = (await response.json()) as { request: ApiRequest };
    expect(request).toMatchObject({ state: "submitted", source: "api", targetName: "Fixture transient", feasibility: { verdict: "feasible" } });
    expect(request.history).toEqual([expect.objectContaining({ from: null, to: "submitted", note: "Filed through the API." })]);

    const again = await read(world.piToken, request.id);
    expect(again.status).toBe(200);
    expect(((await again.json()) as { request: ApiRequest }).request.id).toBe(request.id);
  });

  it("files once for the same Idempotency-Key, answers the same body, and refuses the key with another body", async () => {
    const world = await makeRequestWorld();
    const body = requestBody(world, new Date(), antiSolar(new Date()));
    const key = `alert-${world.piId}`;
    const first = await file(world.piToken, body, key);
    expect(first.status).toBe(201);
    const firstBody = await first.json();
    const second = await file(world.piToken, body, key);
    expect(second.status).toBe(201);
    expect(second.headers.get("idempotent-replayed")).toBe("true");
    expect(await second.json()).toEqual(firstBody);
    expect(await countRequests(world.piId)).toBe(1);

    const changed = await file(world.piToken, { ...body, targetName: "Something else" }, key);
    expect(changed.status).toBe(422);
    expect(((await changed.json()) as ErrorBody).error.code).toBe("idempotency_key_reused");
    expect(await countRequests(world.piId)).toBe(1);
  });

  it("files once when the same key arrives twice at the same moment", async () => {
    const world = await makeRequestWorld();
    const body = requestBody(world, new Date(), antiSolar(new Date()));
    const answers = await Promise.all([file(world.piToken, body, "burst-1"), file(world.piToken, body, "burst-1")]);
    expect(answers.map((a) => a.status)).toEqual([201, 201]);
    const [a, b] = (await Promise.all(answers.map((r) => r.json()))) as { request: ApiRequest }[];
    expect(a?.request.id).toBe(b?.request.id);
    expect(await countRequests(world.piId)).toBe(1);
  });

  it("answers field messages for invalid input, and keeps keys per user", async () => {
    const world = await makeRequestWorld();
    const body = requestBody(world, new Date(), { ra: "12:3x:00", dec: "-95 00 00" }, { targetName: "", telescopeIds: [], durationMinutes: 0 });
    const response = await file(world.piToken, body, "bad-1");
    expect(response.status).toBe(400);
    const { error } = (await response.json()) as ErrorBody;
    expect(error.code).toBe("invalid_input");
    expect(error.fields).toMatchObject({
      targetName: "Name the target.",
      "target.ra": expect.stringMatching(/^Right ascension "12:3x:00": .* \(at character 5\)\.$/),
      "target.dec": expect.stringMatching(/between −90° and \+90°/),
      telescopeIds: "Choose at least one telescope.",
      durationMinutes: "Give whole minutes, 1 to 720.",
    });
    // A failed attempt stores no key: the same key may be used once the body is fixed.
    const fixed = await file(world.piToken, requestBody(world, new Date(), antiSolar(new Date())), "bad-1");
    expect(fixed.status).toBe(201);

    const broken = await call(fileRoute, BASE, { token: world.piToken, body: undefined });
    expect(broken.status).toBe(400);
  });

  it("refuses a request that breaks sun avoidance, with the reason, and files nothing", async () => {
    const world = await makeRequestWorld();
    const response = await file(world.piToken, requestBody(world, new Date(), atTheSun(new Date())), "sunny");
    expect(response.status).toBe(422);
    const { error } = (await response.json()) as ErrorBody;
    expect(error.code).toBe("refused");
    expect(error.fields?.["feasibility.0"]).toMatch(new RegExp(`^Refused for sun avoidance on ${world.telescopeCode}`));
    expect(await countRequests(world.piId)).toBe(0);
  });
});

describe("tokens and who may see what", () => {
  it("answers 401 for a revoked token and for none", async () => {
    const world = await makeRequestWorld();
    const revoked = await makeToken(world.piId, { revoked: true });
    const body = requestBody(world, new Date(), antiSolar(new Date()));
    expect((await file(revoked, body)).status).toBe(401);
    expect((await call(fileRoute, BASE, { body })).status).toBe(401);
    expect(((await (await file(revoked, body)).json()) as ErrorBody).error.code).toBe("invalid_token");
  });

  it("refuses filing to a role other than PI", async () => {
    const world = await makeRequestWorld();
    const observer = await makeUser(["observer"]);
    expect((await file(await makeToken(observer.id), requestBody(world, new Date(), antiSolar(new Date())))).status).toBe(403);
  });

  it("lets a PI read only their own requests; a director reads any", async () => {
    const world = await makeRequestWorld();
    const created = await file(world.piToken, requestBody(world, new Date(), antiSolar(new Date())));
    const { request } = (await created.json()) as { request: ApiRequest };
    const otherPi = await makeUser(["pi"]);
    const director = await makeUser(["director"]);
    const stranger = await read(await makeToken(otherPi.id), request.id);
    expect(stranger.status).toBe(404);
    expect((await read(await makeToken(director.id), request.id)).status).toBe(200);
    expect((await read(world.piToken, "not-a-uuid")).status).toBe(404);
  });

  it("withdraws through the API once, and only for the owner", async () => {
    const world = await makeRequestWorld();
    const { request } = (await (await file(world.piToken, requestBody(world, new Date(), antiSolar(new Date())))).json()) as { request: ApiRequest };
    const url = `${BASE}/${request.id}/withdraw`;
    const otherPi = await makeUser(["pi"]);
    expect((await call(withdrawRoute, url, { token: await makeToken(otherPi.id), params: { id: request.id } })).status).toBe(404);
    const done = await call(withdrawRoute, url, { token: world.piToken, params: { id: request.id }, body: { note: "Superseded by a better alert." } });
    expect(done.status).toBe(200);
    const withdrawn = ((await done.json()) as { request: ApiRequest }).request;
    expect(withdrawn.state).toBe("withdrawn");
    expect(withdrawn.history.at(-1)).toMatchObject({ from: "submitted", to: "withdrawn", note: "Superseded by a better alert." });
    const twice = await call(withdrawRoute, url, { token: world.piToken, params: { id: request.id } });
    expect(twice.status).toBe(409);
  });
});

describe("the sky routes", () => {
  it("previews feasibility with charts for the first nights", async () => {
    const world = await makeRequestWorld();
    const now = new Date();
    const { programId: _p, targetName: _t, urgency: _u, justification: _j, ...preview } = requestBody(world, now, antiSolar(now));
    const response = await call(feasibilityRoute, `${BASE}/feasibility`, { token: world.piToken, body: preview });
    expect(response.status).toBe(200);
    const report = (await response.json()) as { verdict: string; skies: { nights: unknown[] }[]; disclaimer: string };
    expect(report.verdict).toBe("feasible");
    expect(report.skies[0]?.nights.length).toBeGreaterThanOrEqual(3);
    expect(report.disclaimer).toMatch(/Planning aid/);
  });

  it("answers visibility for any signed-in token, and field messages for bad input", async () => {
    const observer = await makeUser(["observer"]);
    const token = await makeToken(observer.id);
    const body = {
      site: { latitudeDeg: -30, longitudeDeg: -70, heightM: 2000, timeZone: "America/Santiago" },
      telescope: { minAltitudeDeg: 20, sunAvoidanceDeg: 40 },
      target: { kind: "fixed", ra: "05:35:17.3", dec: "-05:23:28" },
      when: { night: "2027-01-15" },
    };
    const ok = await call(visibilityRoute, "http://localhost/api/v1/visibility", { token, body });
    expect(ok.status).toBe(200);
    expect(((await ok.json()) as { nights: unknown[] }).nights).toHaveLength(1);
    const bad = await call(visibilityRoute, "http://localhost/api/v1/visibility", { token, body: { ...body, target: { kind: "fixed", ra: "25:00:00", dec: "x" } } });
    expect(bad.status).toBe(400);
    const { error } = (await bad.json()) as ErrorBody;
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(["target.dec", "target.ra"]);
  });
});
