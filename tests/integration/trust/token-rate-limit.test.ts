/**
 * The rate limit on creating API tokens (lib/auth/rate-limit.ts, "token-create": ten an
 * hour per person), as a signed-in person meets it: through the settings page's server
 * action, inside a Next request scope. The service-level test is in
 * tests/integration/requests/tokens.test.ts; this one checks the answer, the budget's
 * owner, and that the count lives in PostgreSQL (so it holds across app instances).
 */
import { describe, expect, it } from "vitest";
import { createTokenAction } from "@/app/(desk)/settings/tokens/actions";
import { getDb } from "@/db/index";
import { makeUser } from "../fixtures";
import { sessionToken, withSessionCookie } from "../request-scope";

async function signedIn() {
  const user = await makeUser(["observer"]);
  const token = await sessionToken(user, ["observer"]);
  const create = (input: unknown) => withSessionCookie("/settings/tokens", token, () => createTokenAction(input));
  const stored = async () => (await getDb().selectFrom("api_tokens").select("id").where("user_id", "=", user.id).execute()).length;
  return { user, create, stored };
}

describe("creating API tokens, at a limited rate", () => {
  it("allows ten an hour, then answers with a plain message and creates nothing", async () => {
    const me = await signedIn();
    for (let i = 1; i <= 10; i++) {
      const result = await me.create({ name: `pipeline ${i}` });
      expect(result, `token ${i}`).toMatchObject({ ok: true, data: { name: `pipeline ${i}` } });
    }
    const refused = await me.create({ name: "one too many" });
    expect(refused.ok).toBe(false);
    expect(refused).toHaveProperty("message", expect.stringMatching(/^Too many attempts\. Try again in \d+ minute\(s\)\.$/));
    expect(refused).not.toHaveProperty("data");
    expect(await me.stored()).toBe(10);
    const audit = await getDb().selectFrom("audit_log").select("id").where("actor_user_id", "=", me.user.id).where("action", "=", "api_token.create").execute();
    expect(audit).toHaveLength(10);

    // The count is a row in PostgreSQL, not a counter in this process.
    const row = await getDb().selectFrom("rate_limits").select(["points", "expire"]).where("key", "like", `%token-create%${me.user.id}`).executeTakeFirstOrThrow();
    expect(row.points).toBeGreaterThanOrEqual(11);
    expect(Number(row.expire)).toBeGreaterThan(Date.now() + 50 * 60_000);
  });

  it("counts per person: one person's spent budget does not stop another", async () => {
    const spent = await signedIn();
    for (let i = 0; i < 10; i++) await spent.create({ name: `script ${i}` });
    expect((await spent.create({ name: "refused" })).ok).toBe(false);
    const other = await signedIn();
    expect(await other.create({ name: "my first token" })).toMatchObject({ ok: true });
    expect(await other.stored()).toBe(1);
  });

  it("does not charge a refused name against the budget", async () => {
    const me = await signedIn();
    for (let i = 0; i < 12; i++) {
      const result = await me.create({ name: "   " });
      expect(result).toMatchObject({ ok: false, fieldErrors: { name: expect.stringMatching(/^Name the token/) } });
    }
    expect(await me.create({ name: "after the typos" })).toMatchObject({ ok: true });
  });
});
