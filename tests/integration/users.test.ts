import { describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { findUserById, EmailTakenError } from "@/lib/users/queries";
import { createUser, LastAdminError, setUserRoles } from "@/lib/users/service";
import { makeUser } from "./fixtures";

describe("managing users", () => {
  it("creates a user with roles, writes the audit trail, and refuses the same e-mail twice", async () => {
    const admin = await makeUser(["admin"]);
    const email = `new-${Date.now()}@fixture.test`;
    const id = await createUser(getDb(), admin.id, { name: "New Person", email, password: "a long enough password", roles: ["observer", "pi"] });
    expect((await findUserById(getDb(), id))?.roles).toEqual(["observer", "pi"]);
    const audit = await getDb().selectFrom("audit_log").selectAll().where("entity_id", "=", id).execute();
    expect(audit.map((a) => a.action)).toEqual(["user.create"]);
    await expect(createUser(getDb(), admin.id, { name: "Again", email, password: "a long enough password", roles: ["pi"] })).rejects.toBeInstanceOf(EmailTakenError);
  });

  it("never removes the last active administrator, and keeps the roles as they were", async () => {
    const db = getDb();
    // Make this user the only active admin: disable every other admin for the duration of the test.
    const admin = await makeUser(["admin"]);
    const others = await db.selectFrom("user_roles").select("user_id").where("role", "=", "admin").where("user_id", "!=", admin.id).execute();
    const otherIds = others.map((o) => o.user_id);
    if (otherIds.length) await db.updateTable("users").set({ disabled_at: new Date() }).where("id", "in", otherIds).execute();
    try {
      await expect(setUserRoles(db, admin.id, admin.id, ["pi"])).rejects.toBeInstanceOf(LastAdminError);
      expect((await findUserById(db, admin.id))?.roles).toEqual(["admin"]);
    } finally {
      if (otherIds.length) await db.updateTable("users").set({ disabled_at: null }).where("id", "in", otherIds).execute();
    }
  });
});
