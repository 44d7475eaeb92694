import { describe, expect, it } from "vitest";
import type { Role } from "@/db/types";
import { GET, POST } from "@/app/api/v1/admin/users/route";
import { makeToken, makeUser } from "./fixtures";

const URL_ = "http://localhost/api/v1/admin/users";
const noParams = { params: Promise.resolve({}) };

function get(token?: string) {
  return GET(new Request(URL_, { headers: token ? { authorization: `Bearer ${token}` } : {} }), noParams);
}

describe("an admin-only route handler", () => {
  it.each<Role>(["pi", "director", "observer", "night_assistant"])("refuses a %s token with 403", async (role) => {
    const user = await makeUser([role]);
    const response = await get(await makeToken(user.id));
    expect(response.status).toBe(403);
    expect(await response.json()).toMatchObject({ error: { code: "forbidden" } });
  });

  it("answers an admin token with the user list", async () => {
    const admin = await makeUser(["admin"]);
    const response = await get(await makeToken(admin.id));
    expect(response.status).toBe(200);
    const body = (await response.json()) as { users: Array<{ id: string }> };
    expect(body.users.map((u) => u.id)).toContain(admin.id);
  });

  it("answers 401 without credentials, with a revoked token, and with a disabled user's token", async () => {
    expect((await get()).status).toBe(401);
    const admin = await makeUser(["admin"]);
    expect((await get(await makeToken(admin.id, { revoked: true }))).status).toBe(401);
    const disabled = await makeUser(["admin"], { disabled: true });
    expect((await get(await makeToken(disabled.id))).status).toBe(401);
  });

  it("validates the body of a create request and reports each bad field", async () => {
    const admin = await makeUser(["admin"]);
    const token = await makeToken(admin.id);
    const response = await POST(
      new Request(URL_, { method: "POST", headers: { authorization: `Bearer ${token}` }, body: JSON.stringify({ name: "", email: "x", password: "short", roles: ["wizard"] }) }),
      noParams,
    );
    expect(response.status).toBe(400);
    const body = (await response.json()) as { error: { fields: Record<string, string> } };
    expect(Object.keys(body.error.fields).sort()).toEqual(["email", "name", "password", "roles.0"]);
    const broken = await POST(new Request(URL_, { method: "POST", headers: { authorization: `Bearer ${token}` }, body: "{not json" }), noParams);
    expect(broken.status).toBe(400);
  });
});
