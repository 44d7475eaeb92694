import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { authorizeCredentials } from "@/lib/auth/credentials";
import { RateLimitedError } from "@/lib/auth/rate-limit";
import { FIXTURE_PASSWORD, makeUser } from "./fixtures";

describe("signing in with e-mail and password", () => {
  it("returns the user with all their roles for the right password, whatever the e-mail's case", async () => {
    const { id, email } = await makeUser(["pi", "observer"]);
    const user = await authorizeCredentials(getDb(), { email: email.toUpperCase(), password: FIXTURE_PASSWORD }, "10.0.0.1");
    expect(user.id).toBe(id);
    expect(user.roles).toEqual(["observer", "pi"]);
  });

  it("refuses a wrong password, an unknown e-mail and a disabled account with the same message", async () => {
    const { email } = await makeUser(["pi"]);
    const disabled = await makeUser(["pi"], { disabled: true });
    const message = "That e-mail and password do not match an active account.";
    await expect(authorizeCredentials(getDb(), { email, password: "wrong password!" }, "10.0.0.2")).rejects.toThrow(message);
    await expect(authorizeCredentials(getDb(), { email: "nobody@fixture.test", password: FIXTURE_PASSWORD }, "10.0.0.2")).rejects.toThrow(message);
    await expect(authorizeCredentials(getDb(), { email: disabled.email, password: FIXTURE_PASSWORD }, "10.0.0.2")).rejects.toThrow(message);
  });

  it("refuses malformed input with a clear message", async () => {
    await expect(authorizeCredentials(getDb(), { email: "not an address", password: "" }, "10.0.0.3")).rejects.toThrow(
      "Enter your e-mail address and password.",
    );
  });

  it("stops an address after ten failed attempts on one account, even with the right password", async () => {
    const { email } = await makeUser(["pi"]);
    for (let i = 0; i < 10; i++) {
      await expect(authorizeCredentials(getDb(), { email, password: `wrong-${i}` }, "10.0.0.4")).rejects.toThrow(/do not match/);
    }
    await expect(authorizeCredentials(getDb(), { email, password: FIXTURE_PASSWORD }, "10.0.0.4")).rejects.toBeInstanceOf(RateLimitedError);
    // Another address is not blocked by the first one's failures.
    await expect(authorizeCredentials(getDb(), { email, password: FIXTURE_PASSWORD }, "10.0.0.5")).resolves.toHaveProperty("email", email);
  });
});
