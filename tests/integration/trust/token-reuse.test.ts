// Bearer tokens are looked up at most once a second per token; revocations and role
// changes made through the app take effect on the very next call.
import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { createApiToken, revokeOwnApiToken } from "@/lib/api-tokens/service";
import { TOKEN_REUSE_MS, userByTokenReused } from "@/lib/api-tokens/token-cache";
import { setUserRoles } from "@/lib/users/service";
import { makeUser } from "../fixtures";

describe("reusing a token's user for a second", () => {
  it("refuses a token revoked through the app at once", async () => {
    const user = await makeUser(["pi"]);
    const { token, secret } = await createApiToken(getDb(), user.id, "pipeline");
    expect((await userByTokenReused(getDb(), secret))?.id).toBe(user.id);
    await revokeOwnApiToken(getDb(), user.id, token.id);
    expect(await userByTokenReused(getDb(), secret)).toBeUndefined();
  });

  it("holds a revocation made elsewhere (another app instance) for at most TOKEN_REUSE_MS", async () => {
    const user = await makeUser(["pi"]);
    const { token, secret } = await createApiToken(getDb(), user.id, "pipeline");
    const t0 = Date.now();
    expect((await userByTokenReused(getDb(), secret, t0))?.id).toBe(user.id);
    await getDb().updateTable("api_tokens").set({ revoked_at: new Date() }).where("id", "=", token.id).execute();
    expect((await userByTokenReused(getDb(), secret, t0 + TOKEN_REUSE_MS - 1))?.id).toBe(user.id);
    expect(await userByTokenReused(getDb(), secret, t0 + TOKEN_REUSE_MS + 1)).toBeUndefined();
  });

  it("sees a role change made through the app at once", async () => {
    const admin = await makeUser(["admin"]);
    const user = await makeUser(["observer"]);
    const { secret } = await createApiToken(getDb(), user.id, "script");
    expect((await userByTokenReused(getDb(), secret))?.roles).toEqual(["observer"]);
    await setUserRoles(getDb(), admin.id, user.id, ["director", "observer"]);
    expect((await userByTokenReused(getDb(), secret))?.roles).toEqual(["director", "observer"]);
  });

  it("never keeps an unknown token", async () => {
    expect(await userByTokenReused(getDb(), "nbk_no_such_token_0000000000000000000000000000")).toBeUndefined();
  });
});
