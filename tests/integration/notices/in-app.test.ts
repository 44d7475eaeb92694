// In-app notices through the API: each person sees, counts and marks only their own;
// e-mail preferences per event.
import { afterAll, describe, expect, it } from "vitest";
import { GET as listNotices } from "@/app/api/v1/notices/route";
import { GET as unreadCount } from "@/app/api/v1/notices/unread-count/route";
import { POST as markRead } from "@/app/api/v1/notices/[id]/read/route";
import { POST as markAllRead } from "@/app/api/v1/notices/read-all/route";
import { GET as getPrefs, PUT as putPrefs } from "@/app/api/v1/notices/preferences/route";
import { getDb } from "@/db/index";
import { noticeDecisionMade } from "@/lib/notices/notify";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { decisionMade } from "../../support/notice-payloads";
import { makeToken, makeUser } from "../fixtures";

const BASE = "http://localhost/api/v1/notices";
const noParams = { params: Promise.resolve({}) };

afterAll(() => closeNoticeQueue());

function auth(token: string, init: RequestInit = {}): RequestInit {
  return { ...init, headers: { authorization: `Bearer ${token}`, ...(init.headers ?? {}) } };
}

async function personWithNotices(count: number) {
  const user = await makeUser(["pi"]);
  const token = await makeToken(user.id);
  await getDb()
    .transaction()
    .execute(async (trx) => {
      for (let i = 0; i < count; i += 1) await noticeDecisionMade(trx, decisionMade({ piUserId: user.id }));
    });
  return { user, token };
}

async function unread(token: string): Promise<number> {
  const response = await unreadCount(new Request(`${BASE}/unread-count`, auth(token)), noParams);
  expect(response.headers.get("cache-control")).toBe("no-store");
  return ((await response.json()) as { unread: number }).unread;
}

describe("in-app notices", () => {
  it("lists and counts only the caller's own notices, newest first", async () => {
    const alice = await personWithNotices(3);
    const bob = await personWithNotices(1);
    const response = await listNotices(new Request(BASE, auth(alice.token)), noParams);
    const body = (await response.json()) as { notices: Array<{ id: string; title: string; link: string; readAt: string | null }>; unread: number };
    expect(body.notices).toHaveLength(3);
    expect(body.unread).toBe(3);
    expect(body.notices[0]?.title).toMatch(/^Your ToO request for .* was approved$/);
    expect(body.notices[0]?.link).toMatch(/^\/requests\//);
    expect(await unread(bob.token)).toBe(1);
  });

  it("marks one read, refuses somebody else's with 404, and marks all read", async () => {
    const alice = await personWithNotices(2);
    const bob = await personWithNotices(1);
    const [bobsNotice] = await getDb().selectFrom("notifications").select("id").where("user_id", "=", bob.user.id).execute();
    const [alicesFirst] = await getDb().selectFrom("notifications").select("id").where("user_id", "=", alice.user.id).execute();
    const post = (token: string, id: string) => markRead(new Request(`${BASE}/${id}/read`, auth(token, { method: "POST" })), { params: Promise.resolve({ id }) });

    expect((await post(alice.token, bobsNotice?.id ?? "")).status).toBe(404);
    expect(await unread(bob.token)).toBe(1);
    expect((await post(alice.token, "not-a-uuid")).status).toBe(404);

    expect((await post(alice.token, alicesFirst?.id ?? "")).status).toBe(204);
    expect(await unread(alice.token)).toBe(1);

    const all = await markAllRead(new Request(`${BASE}/read-all`, auth(alice.token, { method: "POST" })), noParams);
    expect(await all.json()).toEqual({ marked: 1 });
    expect(await unread(alice.token)).toBe(0);
    expect(await unread(bob.token)).toBe(1);
  });

  it("answers 401 without a session or token", async () => {
    expect((await unreadCount(new Request(`${BASE}/unread-count`), noParams)).status).toBe(401);
  });

  it("keeps e-mail on by default and stores the caller's choices per event", async () => {
    const { token } = await personWithNotices(0);
    const read = async () => ((await (await getPrefs(new Request(`${BASE}/preferences`, auth(token)), noParams)).json()) as { email: Record<string, boolean> }).email;
    expect(Object.values(await read()).every(Boolean)).toBe(true);

    const put = (body: unknown) =>
      putPrefs(new Request(`${BASE}/preferences`, auth(token, { method: "PUT", body: JSON.stringify(body), headers: { "content-type": "application/json" } })), noParams);
    expect((await put({ email: { tonight_changed: false } })).status).toBe(200);
    expect(await read()).toMatchObject({ tonight_changed: false, decision_made: true });
    expect((await put({ email: { no_such_event: true } })).status).toBe(400);
  });

  it("still writes the in-app notice but sends no e-mail when the person turned e-mail off", async () => {
    const pi = await makeUser(["pi"]);
    await putPrefs(
      new Request(`${BASE}/preferences`, auth(await makeToken(pi.id), { method: "PUT", body: JSON.stringify({ email: { decision_made: false } }) })),
      noParams,
    );
    const result = await getDb().transaction().execute((trx) => noticeDecisionMade(trx, decisionMade({ piUserId: pi.id })));
    expect(result).toEqual({ notices: 1, emails: 0 });
  });
});
