// Personal API tokens: shown once, stored hashed with a visible prefix, usable as the
// owner until revoked, and created at a limited rate.
import { describe, expect, it } from "vitest";
import { GET as readRoute } from "@/app/api/v1/too-requests/[id]/route";
import { getDb } from "@/db/index";
import { findUserByToken, hashToken, listApiTokens } from "@/lib/api-tokens/queries";
import { createApiToken, revokeOwnApiToken, TOKEN_PREFIX, TokenNotFoundError } from "@/lib/api-tokens/service";
import { RateLimitedError } from "@/lib/auth/rate-limit";
import { makeUser } from "../fixtures";

describe("personal API tokens", () => {
  it("shows the secret once, keeps only its hash, and lists it by prefix", async () => {
    const user = await makeUser(["pi"]);
    const { token, secret } = await createApiToken(getDb(), user.id, "alert pipeline");
    expect(secret).toMatch(new RegExp(`^${TOKEN_PREFIX}[A-Za-z0-9]{40}$`));
    expect(token.prefix).toBe(secret.slice(0, 12));

    const row = await getDb().selectFrom("api_tokens").selectAll().where("id", "=", token.id).executeTakeFirstOrThrow();
    expect(row.token_hash).toBe(hashToken(secret));
    expect(JSON.stringify(row)).not.toContain(secret);
    expect(await listApiTokens(getDb(), user.id)).toEqual([expect.objectContaining({ id: token.id, name: "alert pipeline", prefix: token.prefix, revokedAt: null })]);
    expect((await findUserByToken(getDb(), secret))?.id).toBe(user.id);
  });

  it("stops working once revoked, and only its owner can revoke it", async () => {
    const user = await makeUser(["pi"]);
    const stranger = await makeUser(["pi"]);
    const { token, secret } = await createApiToken(getDb(), user.id, "script");
    await expect(revokeOwnApiToken(getDb(), stranger.id, token.id)).rejects.toBeInstanceOf(TokenNotFoundError);
    await revokeOwnApiToken(getDb(), user.id, token.id);
    expect(await findUserByToken(getDb(), secret)).toBeUndefined();
    const id = "00000000-0000-4000-8000-000000000000";
    const answer = await readRoute(new Request(`http://localhost/api/v1/too-requests/${id}`, { headers: { authorization: `Bearer ${secret}` } }), { params: Promise.resolve({ id }) });
    expect(answer.status).toBe(401);
    await expect(revokeOwnApiToken(getDb(), user.id, token.id)).rejects.toBeInstanceOf(TokenNotFoundError);
  });

  it("limits how many tokens one person can create in an hour", async () => {
    const user = await makeUser(["observer"]);
    for (let i = 0; i < 10; i++) await createApiToken(getDb(), user.id, `token ${i}`);
    await expect(createApiToken(getDb(), user.id, "one too many")).rejects.toBeInstanceOf(RateLimitedError);
    expect(await listApiTokens(getDb(), user.id)).toHaveLength(10);
  });
});
