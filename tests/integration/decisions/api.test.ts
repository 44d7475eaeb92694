import { afterAll, describe, expect, it } from "vitest";
import { GET as IMPACT } from "@/app/api/v1/impact/route";
import { GET as LEDGER } from "@/app/api/v1/ledger/route";
import { POST as DECIDE } from "@/app/api/v1/too-requests/[id]/decision/route";
import { getDb } from "@/db/index";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { makeToken, makeUser } from "../fixtures";
import { makeSubmittedRequest, makeWorld } from "./world";

afterAll(async () => {
  await closeNoticeQueue();
});

const base = "http://localhost/api/v1";
type Json = Record<string, unknown> & { error?: { code: string; message: string; fields?: Record<string, string> } };

async function decide(token: string | null, id: string, body: unknown) {
  const response = await DECIDE(
    new Request(`${base}/too-requests/${id}/decision`, { method: "POST", headers: token ? { authorization: `Bearer ${token}` } : {}, body: JSON.stringify(body) }),
    { params: Promise.resolve({ id }) },
  );
  return { status: response.status, body: (await response.json()) as Json };
}

async function get(handler: (r: Request, c: { params: Promise<Record<string, string>> }) => Promise<Response>, token: string, url: string) {
  const response = await handler(new Request(url, { headers: { authorization: `Bearer ${token}` } }), { params: Promise.resolve({}) });
  return { status: response.status, response };
}

async function directorToken(world: Awaited<ReturnType<typeof makeWorld>>) {
  return makeToken(world.director.id);
}

describe("POST /api/v1/too-requests/{id}/decision", () => {
  it("is for directors only: no token 401, a PI or an observer 403, an unknown request 404", async () => {
    const world = await makeWorld([]);
    const id = await makeSubmittedRequest(world);
    const body = { decision: "decline", reason: "No." };
    expect((await decide(null, id, body)).status).toBe(401);
    expect((await decide(await makeToken(world.piId), id, body)).status).toBe(403);
    expect((await decide(await makeToken(world.observer.id), id, body)).status).toBe(403);
    const token = await directorToken(world);
    expect((await decide(token, "00000000-0000-4000-8000-000000000000", body)).status).toBe(404);
    expect((await decide(token, "not-a-uuid", body)).status).toBe(404);
  });

  it("validates: a reason to decline, a note to return, a slot that ends after it starts, a known decision", async () => {
    const world = await makeWorld([]);
    const id = await makeSubmittedRequest(world);
    const token = await directorToken(world);
    const noReason = await decide(token, id, { decision: "decline", reason: "   " });
    expect(noReason.status).toBe(400);
    expect(noReason.body.error?.fields?.reason).toBe("Give the PI a reason for declining.");
    const noNote = await decide(token, id, { decision: "return" });
    expect(noNote.body.error?.fields?.note).toBe("Tell the PI what to change.");
    const backwards = await decide(token, id, { decision: "approve", telescopeId: world.telescopeId, start: "2027-06-01T02:00:00Z", end: "2027-06-01T01:00:00Z" });
    expect(backwards.status).toBe(400);
    expect(backwards.body.error?.fields?.end).toBe("The slot must end after it starts.");
    const unknown = await decide(token, id, { decision: "maybe" });
    expect(unknown.status).toBe(400);
    const wrongScope = await decide(token, id, { decision: "approve", telescopeId: "00000000-0000-4000-8000-000000000000", start: "2027-06-01T01:00:00Z", end: "2027-06-01T02:00:00Z" });
    expect(wrongScope.status).toBe(400);
    expect(wrongScope.body.error?.message).toBe("The PI did not accept that telescope for this request.");
    const state = await getDb().selectFrom("too_requests").select("state").where("id", "=", id).executeTakeFirstOrThrow();
    expect(state.state).toBe("submitted");
  });

  it("approves a slot (harmlessly twice), declines with a reason, returns with a note", async () => {
    const world = await makeWorld([["2027-06-02T00:00:00Z", "2027-06-02T04:00:00Z"]]);
    const token = await directorToken(world);
    const a = await makeSubmittedRequest(world, "Object A");
    const slot = { decision: "approve", telescopeId: world.telescopeId, start: "2027-06-02T01:00:00Z", end: "2027-06-02T02:00:00Z", note: "Go ahead." };
    const approved = await decide(token, a, slot);
    expect(approved.status).toBe(200);
    expect(approved.body).toMatchObject({ requestId: a, decision: "approve", state: "approved", alreadyApproved: false, displacedMinutes: 60 });
    expect((await decide(token, a, slot)).body).toMatchObject({ alreadyApproved: true });
    const late = await decide(token, a, { decision: "decline", reason: "Changed my mind." });
    expect(late.status).toBe(409);
    expect(late.body.error?.message).toMatch(/approved: it can no longer be declined/);

    const b = await makeSubmittedRequest(world, "Object B");
    expect((await decide(token, b, { decision: "decline", reason: "The target sets too early." })).body).toMatchObject({ state: "declined" });
    const c = await makeSubmittedRequest(world, "Object C");
    expect((await decide(token, c, { decision: "return", note: "Add a finding chart." })).body).toMatchObject({ state: "draft" });
  });

  it("answers 409 with a plain reason to an approval after the PI's deadline, and the request lapses", async () => {
    const world = await makeWorld([["2027-06-06T00:00:00Z", "2027-06-06T04:00:00Z"]]);
    const token = await directorToken(world);
    const deadline = new Date(Date.now() - 3_600_000);
    const id = await makeSubmittedRequest(world, "Too late", { earliestStart: new Date(deadline.getTime() - 86_400_000), deadline });
    const answer = await decide(token, id, { decision: "approve", telescopeId: world.telescopeId, start: "2027-06-06T01:00:00Z", end: "2027-06-06T02:00:00Z" });
    expect(answer.status).toBe(409);
    expect(answer.body.error?.code).toBe("conflict");
    expect(answer.body.error?.message).toMatch(/^The PI's deadline \(.+ UT\) has passed, so this request has lapsed and can no longer be approved\. Nothing was changed\.$/);
    const row = await getDb().selectFrom("too_requests").select("state").where("id", "=", id).executeTakeFirstOrThrow();
    expect(row.state).toBe("lapsed");
  });

  it("lets exactly one of many concurrent overlapping approvals through; the others get 409 with the fresh impact", async () => {
    const world = await makeWorld([["2027-06-03T00:00:00Z", "2027-06-03T04:00:00Z"], ["2027-06-03T04:00:00Z", "2027-06-03T08:00:00Z"]]);
    const token = await directorToken(world);
    const ids = await Promise.all([0, 1, 2, 3, 4, 5].map((i) => makeSubmittedRequest(world, `Object ${i}`)));
    const answers = await Promise.all(
      ids.map((id, i) => decide(token, id, { decision: "approve", telescopeId: world.telescopeId, start: new Date(Date.parse("2027-06-03T02:00:00Z") + i * 10 * 60_000).toISOString(), end: new Date(Date.parse("2027-06-03T04:30:00Z") + i * 10 * 60_000).toISOString() })),
    );
    expect(answers.filter((a) => a.status === 200)).toHaveLength(1);
    const losers = answers.filter((a) => a.status === 409);
    expect(losers).toHaveLength(5);
    for (const l of losers) {
      expect(l.body.error?.code).toBe("slot_taken");
      expect(l.body.error?.message).toMatch(/Nothing was changed: look at the fresh impact and choose again\./);
      const impact = l.body.impact as { approvable: boolean; blockedBy: unknown[] };
      expect(impact.approvable).toBe(false);
      expect(impact.blockedBy).toHaveLength(1);
    }
    const blocks = await getDb().selectFrom("blocks").select(["kind", "starts_at", "ends_at"]).where("telescope_id", "=", world.telescopeId).orderBy("starts_at").execute();
    expect(blocks.filter((b) => b.kind === "too")).toHaveLength(1);
    for (let i = 1; i < blocks.length; i++) expect(blocks[i]!.starts_at.getTime()).toBeGreaterThanOrEqual(blocks[i - 1]!.ends_at.getTime());
  });
});

describe("GET /api/v1/impact and GET /api/v1/ledger", () => {
  it("previews a slot for directors and admins, by telescope id or code", async () => {
    const world = await makeWorld([["2027-06-04T00:00:00Z", "2027-06-04T04:00:00Z"]]);
    const token = await directorToken(world);
    const code = (await getDb().selectFrom("telescopes").select("code").where("id", "=", world.telescopeId).executeTakeFirstOrThrow()).code;
    const url = `${base}/impact?telescope=${code.toLowerCase()}&start=2027-06-04T03:00:00Z&end=2027-06-04T05:00:00Z`;
    const ok = await get(IMPACT, token, url);
    expect(ok.status).toBe(200);
    const { impact } = (await ok.response.json()) as { impact: { displacedMinutes: number; blocks: Array<{ change: string; observerEmail: string }>; byObserver: Array<{ minutes: number }> } };
    expect(impact.displacedMinutes).toBe(60);
    expect(impact.blocks[0]).toMatchObject({ change: "trim-end", observerEmail: world.observer.email });
    expect((await get(IMPACT, await makeToken(world.piId), url)).status).toBe(403);
    const admin = await makeUser(["admin"]);
    expect((await get(IMPACT, await makeToken(admin.id), url)).status).toBe(200);
    const bad = await get(IMPACT, token, `${base}/impact?telescope=${code}&start=2027-06-04T05:00:00Z&end=2027-06-04T03:00:00Z`);
    expect(bad.status).toBe(400);
    expect((await get(IMPACT, token, `${base}/impact?telescope=NOPE&start=2027-06-04T03:00:00Z&end=2027-06-04T05:00:00Z`)).status).toBe(404);
  });

  it("answers balances as JSON or CSV; a night assistant may not read it", async () => {
    const world = await makeWorld([["2027-06-05T00:00:00Z", "2027-06-05T04:00:00Z"]]);
    const token = await directorToken(world);
    const id = await makeSubmittedRequest(world);
    await decide(token, id, { decision: "approve", telescopeId: world.telescopeId, start: "2027-06-05T01:00:00Z", end: "2027-06-05T01:45:00Z" });
    const json = await get(LEDGER, token, `${base}/ledger`);
    const body = (await json.response.json()) as { programs: Array<{ programId: string; owedMinutes: number }> };
    expect(body.programs.find((p) => p.programId === world.programId)?.owedMinutes).toBe(45);
    const csv = await get(LEDGER, await makeToken(world.observer.id), `${base}/ledger?format=csv`);
    expect(csv.response.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(csv.response.headers.get("content-disposition")).toMatch(/^attachment; filename="nightbreak-ledger-\d{4}-\d{2}-\d{2}\.csv"$/);
    const lines = (await csv.response.text()).split("\r\n");
    expect(lines).toHaveLength(2);
    expect(lines[1]).toMatch(/,45,0,45,0\.75$/);
    const assistant = await makeUser(["night_assistant"]);
    expect((await get(LEDGER, await makeToken(assistant.id), `${base}/ledger`)).status).toBe(403);
    expect((await get(LEDGER, token, `${base}/ledger?semester=nope`)).status).toBe(400);
  });
});
