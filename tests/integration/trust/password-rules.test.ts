/**
 * The password rules end to end: the admin API and the admin form's server action refuse
 * a password outside 12–200 characters beside the password field and save nothing; a
 * plain long passphrase is accepted, stored only as a bcrypt hash, and signs in.
 */
import { describe, expect, it } from "vitest";
import { createUserAction } from "@/app/(desk)/admin/users/actions";
import { POST as createUserRoute } from "@/app/api/v1/admin/users/route";
import { getDb } from "@/db/index";
import { authorizeCredentials } from "@/lib/auth/credentials";
import { makeToken, makeUser } from "../fixtures";
import { sessionToken, withSessionCookie } from "../request-scope";

let serial = 0;
const newEmail = () => `password-rules-${Date.now()}-${(serial += 1)}@fixture.test`;

async function post(token: string, body: unknown): Promise<Response> {
  const request = new Request("http://127.0.0.1/api/v1/admin/users", {
    method: "POST",
    headers: { authorization: `Bearer ${token}`, "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  return createUserRoute(request, { params: Promise.resolve({}) });
}

const saved = async (email: string) => (await getDb().selectFrom("users").select(["id", "password_hash"]).where("email", "=", email).executeTakeFirst()) ?? null;

describe("the password rules through the admin API", () => {
  it("refuses a password that is too short or too long, beside the field, saving nothing", async () => {
    const token = await makeToken((await makeUser(["admin"])).id);
    for (const [password, reason] of [
      ["eleven char", "Use at least 12 characters."],
      ["x".repeat(201), "Use at most 200 characters."],
    ] as const) {
      const email = newEmail();
      const answer = await post(token, { name: "Short Password", email, password, roles: ["observer"] });
      expect(answer.status).toBe(400);
      expect(await answer.json()).toEqual({ error: { code: "invalid_input", message: "Some fields are not valid.", fields: { password: reason } } });
      expect(await saved(email)).toBeNull();
    }
  });

  it("accepts a plain twelve-character passphrase, keeps only its hash, and lets the person sign in", async () => {
    const token = await makeToken((await makeUser(["admin"])).id);
    const email = newEmail();
    const password = "night skies!";
    expect(password).toHaveLength(12);
    const answer = await post(token, { name: "Passphrase Person", email, password, roles: ["observer"] });
    expect(answer.status).toBe(201);
    const row = await saved(email);
    expect(row?.password_hash).toMatch(/^\$2[aby]\$11\$/);
    expect(row?.password_hash).not.toContain(password);
    await expect(authorizeCredentials(getDb(), { email, password }, "10.9.0.1")).resolves.toMatchObject({ email, roles: ["observer"] });
    await expect(authorizeCredentials(getDb(), { email, password: password.toUpperCase() }, "10.9.0.1")).rejects.toThrow(/do not match/);
  });
});

describe("the password rules through the admin form", () => {
  it("answers the form with the rule beside the password, and creates the user once it is met", async () => {
    const admin = await makeUser(["admin"]);
    const session = await sessionToken(admin, ["admin"]);
    const email = newEmail();
    const submit = (password: string) =>
      withSessionCookie("/admin/users", session, () => createUserAction({ name: "Form Person", email, password, roles: ["pi"] }));

    expect(await submit("short")).toEqual({ ok: false, message: "Some fields need attention.", fieldErrors: { password: "Use at least 12 characters." } });
    expect(await saved(email)).toBeNull();
    expect(await submit("a much longer passphrase")).toEqual({ ok: true, message: `Form Person can now sign in as ${email}.` });
    expect(await saved(email)).not.toBeNull();
  });
});
