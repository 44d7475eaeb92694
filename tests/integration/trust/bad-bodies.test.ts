/**
 * Oversized, malformed and nonsensical bodies sent to the two routes that write the most
 * (filing a ToO request, creating a block) answer 4xx and leave every table as it was.
 */
import { randomUUID } from "node:crypto";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { POST as createBlock } from "@/app/api/v1/blocks/route";
import { POST as fileRequest } from "@/app/api/v1/too-requests/route";
import { getDb } from "@/db/index";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { makeTelescopeAndProgram, makeToken, makeUser } from "../fixtures";
import { antiSolar, makeRequestWorld, requestBody, type RequestWorld } from "../requests/fixtures";

const TABLES = ["too_requests", "too_request_telescopes", "request_events", "attachments", "idempotency_keys", "blocks", "audit_log", "notifications", "schedule_changes"] as const;

async function counts(): Promise<Record<string, number>> {
  const db = getDb();
  const out: Record<string, number> = {};
  for (const table of TABLES) {
    const row = await db.selectFrom(table).select((eb) => eb.fn.countAll<string>().as("n")).executeTakeFirstOrThrow();
    out[table] = Number(row.n);
  }
  return out;
}

type Handler = (request: Request, route: { params: Promise<Record<string, string>> }) => Promise<Response>;

function send(handler: Handler, path: string, token: string, body: string, headers: Record<string, string> = {}) {
  const request = new Request(`http://127.0.0.1${path}`, {
    method: "POST",
    headers: { authorization: `Bearer ${token}`, "content-type": "application/json", ...headers },
    body,
  });
  return handler(request, { params: Promise.resolve({}) });
}

let world: RequestWorld;
let adminToken: string;
let blockBody: Record<string, unknown>;
let validRequest: string;

beforeAll(async () => {
  world = await makeRequestWorld();
  adminToken = await makeToken((await makeUser(["admin"])).id);
  const { telescopeId, programId } = await makeTelescopeAndProgram();
  blockBody = { telescopeId, programId, kind: "science", startsAt: "2027-02-10T01:00:00Z", endsAt: "2027-02-10T04:00:00Z" };
  const now = new Date();
  validRequest = JSON.stringify(requestBody(world, now, antiSolar(now)));
});

afterAll(async () => {
  await closeNoticeQueue();
});

describe("POST /api/v1/too-requests with a bad body", () => {
  const file = (body: string) => send(fileRequest as Handler, "/api/v1/too-requests", world.piToken, body, { "idempotency-key": `bad-${randomUUID()}` });

  it("answers 413 to an oversized body and 400 to a malformed one, saving nothing", async () => {
    const before = await counts();
    const huge = JSON.stringify({ ...(JSON.parse(validRequest) as object), justification: "x".repeat(2_100_000) });
    const oversized = await file(huge);
    expect(oversized.status).toBe(413);
    expect(await oversized.json()).toMatchObject({ error: { code: "too_large" } });
    for (const body of [validRequest.slice(0, -1), validRequest.slice(0, validRequest.length / 2), "", "{", "not json", "\u0000", `${validRequest}}`]) {
      const response = await file(body);
      expect(response.status, JSON.stringify(body.slice(0, 40))).toBe(400);
    }
    expect(await counts()).toEqual(before);
    // The control: the same body, whole, is filed — so the counts above could have moved.
    expect((await file(validRequest)).status).toBe(201);
    expect((await counts()).too_requests).toBe(before.too_requests! + 1);
  });

  it("answers 4xx to any JSON value that is not a request, saving nothing", async () => {
    const before = await counts();
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), async (value) => {
        const response = await file(JSON.stringify(value) ?? "null");
        expect(response.status).toBeGreaterThanOrEqual(400);
        expect(response.status).toBeLessThan(500);
      }),
      { numRuns: 40 },
    );
    expect(await counts()).toEqual(before);
  });
});

describe("POST /api/v1/blocks with a bad body", () => {
  const create = (body: string) => send(createBlock as Handler, "/api/v1/blocks", adminToken, body);

  it("answers 413 to an oversized body and 400 to a malformed one, saving nothing", async () => {
    const before = await counts();
    const oversized = await create(JSON.stringify({ ...blockBody, notes: "x".repeat(1_100_000) }));
    expect(oversized.status).toBe(413);
    const valid = JSON.stringify(blockBody);
    for (const body of [valid.slice(0, -1), "", "[", "undefined", `${valid},`]) {
      expect((await create(body)).status).toBe(400);
    }
    expect(await counts()).toEqual(before);
    expect((await create(valid)).status).toBe(201);
    expect((await counts()).blocks).toBe(before.blocks! + 1);
  });

  it("answers 4xx to any JSON value that is not a block, saving nothing", async () => {
    const before = await counts();
    await fc.assert(
      fc.asyncProperty(fc.jsonValue(), async (value) => {
        const response = await create(JSON.stringify(value) ?? "null");
        expect(response.status).toBeGreaterThanOrEqual(400);
        expect(response.status).toBeLessThan(500);
      }),
      { numRuns: 40 },
    );
    expect(await counts()).toEqual(before);
  });
});
