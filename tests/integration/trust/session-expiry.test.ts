/**
 * Session expiry: a session cookie older than the session length (lib/auth/options.ts,
 * twelve hours) or signed with another secret is no session at all. Route handlers answer
 * 401, pages send the browser to the sign-in page, server actions say the session ended —
 * through the real next-auth session check inside a Next request scope.
 */
import { afterEach, beforeAll, describe, expect, it, vi } from "vitest";
import UsersPage from "@/app/(desk)/admin/users/page";
import { createTokenAction } from "@/app/(desk)/settings/tokens/actions";
import { GET as listUsersRoute } from "@/app/api/v1/admin/users/route";
import { getDb } from "@/db/index";
import { authOptions } from "@/lib/auth/options";
import { makeUser } from "../fixtures";
import { sessionToken, withSessionCookie } from "../request-scope";

const HOUR = 3_600_000;
const ago = (ms: number) => new Date(Date.now() - ms);

let admin: { id: string; email: string };

beforeAll(async () => {
  admin = await makeUser(["admin"]);
});

afterEach(() => {
  vi.restoreAllMocks();
});

/** next-auth logs why it refused a token; keep that out of the output but hand it to the test. */
function captureAuthErrors(): () => string {
  const spy = vi.spyOn(console, "error").mockImplementation(() => undefined);
  return () => spy.mock.calls.map((args) => args.map((a) => (a instanceof Object ? JSON.stringify(a) : String(a))).join(" ")).join("\n");
}

const callApi = (token: string) => withSessionCookie("/api/v1/admin/users", token, (request) => listUsersRoute(request, { params: Promise.resolve({}) }));
const openPage = (token: string) => withSessionCookie("/admin/users", token, () => UsersPage());

/** The `redirect()` error a page throws, as Next turns it into a 307: its target, or null. */
async function redirectTarget(page: Promise<unknown>): Promise<string | null> {
  try {
    await page;
    return null;
  } catch (error) {
    const digest = (error as { digest?: unknown }).digest;
    if (typeof digest === "string" && digest.startsWith("NEXT_REDIRECT;")) return digest.split(";")[2] ?? "";
    throw error;
  }
}

describe("the session length", () => {
  it("is twelve hours (one observing night and a margin), for the session and its token", () => {
    expect(authOptions.session?.maxAge).toBe(12 * 3600);
    expect(authOptions.jwt?.maxAge).toBe(12 * 3600);
  });

  it("lets a fresh session, and one near the end of its twelve hours, through", async () => {
    for (const issuedAt of [new Date(), ago(11.5 * HOUR)]) {
      const token = await sessionToken(admin, ["admin"], { issuedAt });
      const answer = await callApi(token);
      expect(answer.status, `issued ${issuedAt.toISOString()}`).toBe(200);
      expect(((await answer.json()) as { users: Array<{ id: string }> }).users.map((u) => u.id)).toContain(admin.id);
      expect(await redirectTarget(openPage(token))).toBeNull();
    }
  });
});

describe("an expired session", () => {
  it("is refused by the API with 401, as if there were no cookie", async () => {
    const logged = captureAuthErrors();
    const token = await sessionToken(admin, ["admin"], { issuedAt: ago(12 * HOUR + 60_000) });
    const answer = await callApi(token);
    expect(answer.status).toBe(401);
    expect(await answer.json()).toEqual({ error: { code: "unauthenticated", message: "Sign in or send an API token." } });
    expect(logged()).toMatch(/JWT_SESSION_ERROR.*"exp" claim timestamp check failed/s);
  });

  it("sends a page to the sign-in page", async () => {
    captureAuthErrors();
    const token = await sessionToken(admin, ["admin"], { issuedAt: ago(3 * 24 * HOUR) });
    expect(await redirectTarget(openPage(token))).toBe("/sign-in");
  });

  it("makes a server action answer that the session has ended, and do nothing", async () => {
    captureAuthErrors();
    const token = await sessionToken(admin, ["admin"], { issuedAt: ago(13 * HOUR) });
    const result = await withSessionCookie("/settings/tokens", token, () => createTokenAction({ name: "after hours" }));
    expect(result).toEqual({ ok: false, message: "Your session has ended: sign in again." });
    const tokens = await getDb().selectFrom("api_tokens").select("id").where("user_id", "=", admin.id).execute();
    expect(tokens).toEqual([]);
  });
});

describe("a forged session", () => {
  it("signed with another secret is refused, though it is fresh and names an admin", async () => {
    const logged = captureAuthErrors();
    const token = await sessionToken(admin, ["admin"], { secret: "not-the-server-secret" });
    expect((await callApi(token)).status).toBe(401);
    expect(await redirectTarget(openPage(token))).toBe("/sign-in");
    expect(logged()).toContain("JWT_SESSION_ERROR");
  });
});
