import { sql } from "kysely";
import type { Db } from "@/db/index";
import type { Role } from "@/db/types";
import { hashPassword } from "@/lib/auth/password";
import { writeAudit } from "@/lib/audit/queries";
import { countAdmins, insertUser, replaceUserRoles } from "./queries";
import type { CreateUserInput } from "./schemas";
import { forgetTokenUsers } from "@/lib/api-tokens/token-cache";

export class LastAdminError extends Error {
  constructor() {
    super("At least one administrator must remain: give another user the admin role first.");
  }
}

export async function createUser(db: Db, actorId: string, input: CreateUserInput): Promise<string> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction().execute(async (trx) => {
    const id = await insertUser(trx, { ...input, passwordHash });
    await writeAudit(trx, { actorUserId: actorId, action: "user.create", entity: "user", entityId: id, details: { roles: input.roles } });
    return id;
  });
}

export async function setUserRoles(db: Db, actorId: string, userId: string, roles: Role[]): Promise<void> {
  await db.transaction().execute(async (trx) => {
    // Serialise role changes so two admins cannot remove each other's admin role at once.
    await sql`select pg_advisory_xact_lock(hashtext('user_roles'))`.execute(trx);
    await replaceUserRoles(trx, userId, roles);
    if ((await countAdmins(trx)) === 0) throw new LastAdminError();
    await writeAudit(trx, { actorUserId: actorId, action: "user.roles", entity: "user", entityId: userId, details: { roles } });
  });
  forgetTokenUsers();
}
