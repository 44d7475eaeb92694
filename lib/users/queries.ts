import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import type { Role } from "@/db/types";

export interface User {
  id: string;
  email: string;
  name: string;
  roles: Role[];
  disabled: boolean;
}

interface UserWithHash extends User {
  passwordHash: string;
}

function usersWithRoles(db: Db | Trx) {
  return db
    .selectFrom("users as u")
    .select([
      "u.id",
      "u.email",
      "u.name",
      "u.password_hash",
      "u.disabled_at",
      sql<Role[]>`coalesce((select array_agg(r.role order by r.role) from user_roles r where r.user_id = u.id), '{}')`.as("roles"),
    ]);
}

type Row = {
  id: string;
  email: string;
  name: string;
  password_hash: string;
  disabled_at: Date | null;
  roles: Role[];
};

function toUser(row: Row): User {
  return { id: row.id, email: row.email, name: row.name, roles: row.roles, disabled: row.disabled_at !== null };
}

export async function findUserByEmailWithHash(db: Db, email: string): Promise<UserWithHash | undefined> {
  const row = await usersWithRoles(db).where("u.email", "=", email.toLowerCase()).executeTakeFirst();
  return row && { ...toUser(row), passwordHash: row.password_hash };
}

export async function findUserById(db: Db, id: string): Promise<User | undefined> {
  const row = await usersWithRoles(db).where("u.id", "=", id).executeTakeFirst();
  return row && toUser(row);
}

/** The user behind a live API token (by the token's hash) and when the token was last used, in one round trip. */
export async function findUserByTokenHash(db: Db, hash: string): Promise<{ user: User; tokenLastUsedAt: Date | null } | undefined> {
  const row = await usersWithRoles(db)
    .innerJoin("api_tokens as t", "t.user_id", "u.id")
    .select("t.last_used_at")
    .where("t.token_hash", "=", hash)
    .where("t.revoked_at", "is", null)
    .executeTakeFirst();
  return row && { user: toUser(row), tokenLastUsedAt: row.last_used_at };
}

export async function listUsers(db: Db): Promise<User[]> {
  const rows = await usersWithRoles(db).orderBy("u.name").execute();
  return rows.map(toUser);
}

export class EmailTakenError extends Error {
  constructor(email: string) {
    super(`A user with the e-mail ${email} already exists.`);
  }
}

export async function insertUser(
  trx: Trx,
  input: { email: string; name: string; passwordHash: string; roles: readonly Role[] },
): Promise<string> {
  const existing = await trx.selectFrom("users").select("id").where("email", "=", input.email).executeTakeFirst();
  if (existing) throw new EmailTakenError(input.email);
  const { id } = await trx
    .insertInto("users")
    .values({ email: input.email, name: input.name, password_hash: input.passwordHash })
    .returning("id")
    .executeTakeFirstOrThrow();
  await replaceUserRoles(trx, id, input.roles);
  return id;
}

export async function replaceUserRoles(trx: Trx, userId: string, roles: readonly Role[]): Promise<void> {
  await trx.deleteFrom("user_roles").where("user_id", "=", userId).execute();
  if (roles.length) {
    await trx.insertInto("user_roles").values(roles.map((role) => ({ user_id: userId, role }))).execute();
  }
}

export async function countAdmins(trx: Trx): Promise<number> {
  const { n } = await trx
    .selectFrom("user_roles")
    .innerJoin("users", "users.id", "user_roles.user_id")
    .select((eb) => eb.fn.countAll<number>().as("n"))
    .where("role", "=", "admin")
    .where("users.disabled_at", "is", null)
    .executeTakeFirstOrThrow();
  return Number(n);
}

/** A person offered in a picker (PI, observers, night assistants). */
export interface PersonOption {
  id: string;
  name: string;
  email: string;
}

/** Active users holding a role, for the admin pickers. */
export async function listPeopleWithRole(db: Db, role: Role): Promise<PersonOption[]> {
  return db
    .selectFrom("users as u")
    .innerJoin("user_roles as r", "r.user_id", "u.id")
    .select(["u.id", "u.name", "u.email"])
    .where("r.role", "=", role)
    .where("u.disabled_at", "is", null)
    .orderBy("u.name")
    .execute();
}

/** Of the given users, those who do not hold the role (unknown ids included, named by id). */
export async function findPeopleWithoutRole(trx: Db | Trx, userIds: readonly string[], role: Role): Promise<PersonOption[]> {
  if (userIds.length === 0) return [];
  const rows = await trx
    .selectFrom("users as u")
    .select(["u.id", "u.name", "u.email"])
    .where("u.id", "in", userIds)
    .where((eb) => eb.exists(eb.selectFrom("user_roles as r").select("r.role").whereRef("r.user_id", "=", "u.id").where("r.role", "=", role)))
    .execute();
  const holders = new Set(rows.map((r) => r.id));
  const missing = userIds.filter((id) => !holders.has(id));
  if (missing.length === 0) return [];
  const known = await trx.selectFrom("users").select(["id", "name", "email"]).where("id", "in", missing).execute();
  return missing.map((id) => known.find((k) => k.id === id) ?? { id, name: `an unknown user (${id.slice(0, 8)})`, email: "" });
}
