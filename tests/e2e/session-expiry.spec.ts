/**
 * Session expiry against the production build: the session cookie a real sign-in set,
 * re-issued with the same claims but already expired, is no session — the API answers
 * 401 and a page sends the browser to the sign-in page. (The twelve-hour boundary itself
 * is checked in tests/integration/trust/session-expiry.test.ts.) Needs the app's
 * NEXTAUTH_SECRET in the environment, as scripts/test.sh exports it.
 */
import { expect, test } from "@playwright/test";
import { decode, encode } from "next-auth/jwt";
import { DEMO, signIn } from "./helpers";

test("an expired session cookie is refused: 401 from the API, the sign-in page for a page", async ({ page, context }) => {
  const secret = process.env.NEXTAUTH_SECRET;
  if (!secret) throw new Error("NEXTAUTH_SECRET must be the app's (scripts/test.sh exports it)");

  await signIn(page, DEMO.admin.email);
  const cookie = (await context.cookies()).find((c) => c.name.endsWith("next-auth.session-token"));
  if (!cookie) throw new Error("no session cookie after signing in");
  expect((await page.request.get("/api/v1/admin/users")).status()).toBe(200);

  const claims = await decode({ token: cookie.value, secret });
  if (!claims) throw new Error("the session cookie does not decode with this NEXTAUTH_SECRET");
  expect(claims.uid).toBeTruthy();
  // Same claims, expired a minute ago (next-auth allows 15 s of clock skew).
  const expired = await encode({ token: claims, secret, maxAge: -60 });
  await context.addCookies([{ ...cookie, value: expired }]);

  const api = await page.request.get("/api/v1/admin/users");
  expect(api.status()).toBe(401);
  expect(await api.json()).toMatchObject({ error: { code: "unauthenticated" } });
  await page.goto("/admin/users");
  await expect(page).toHaveURL(/\/sign-in(\?|$)/);
});
