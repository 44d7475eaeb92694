import { createHash } from "node:crypto";
import type { Db, Trx } from "@/db/index";
import { findUserByTokenHash, type User } from "@/lib/users/queries";

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

/** The user behind a bearer token, or undefined when the token is unknown, revoked or its user disabled. */
export async function findUserByToken(db: Db, token: string): Promise<User | undefined> {
  const hash = hashToken(token);
  const found = await findUserByTokenHash(db, hash);
  if (!found) return undefined;
  // Record use at most once a minute: a write (and its row lock) on every request would
  // serialise a busy pipeline's calls on one token.
  if (!found.tokenLastUsedAt || Date.now() - found.tokenLastUsedAt.getTime() > 60_000) {
    await db.updateTable("api_tokens").set({ last_used_at: new Date() }).where("token_hash", "=", hash).execute();
  }
  return found.user.disabled ? undefined : found.user;
}

/** A personal API token as its owner sees it: never the secret, only its visible prefix. */
export interface ApiToken {
  id: string;
  name: string;
  prefix: string;
  createdAt: Date;
  lastUsedAt: Date | null;
  revokedAt: Date | null;
}

export async function insertApiToken(trx: Db | Trx, values: { userId: string; name: string; prefix: string; hash: string }): Promise<ApiToken> {
  const row = await trx
    .insertInto("api_tokens")
    .values({ user_id: values.userId, name: values.name, token_prefix: values.prefix, token_hash: values.hash })
    .returning(["id", "name", "token_prefix", "created_at", "last_used_at", "revoked_at"])
    .executeTakeFirstOrThrow();
  return { id: row.id, name: row.name, prefix: row.token_prefix, createdAt: row.created_at, lastUsedAt: row.last_used_at, revokedAt: row.revoked_at };
}

export async function listApiTokens(db: Db, userId: string): Promise<ApiToken[]> {
  const rows = await db
    .selectFrom("api_tokens")
    .select(["id", "name", "token_prefix", "created_at", "last_used_at", "revoked_at"])
    .where("user_id", "=", userId)
    .orderBy("revoked_at", (ob) => ob.desc().nullsFirst())
    .orderBy("created_at", "desc")
    .execute();
  return rows.map((r) => ({ id: r.id, name: r.name, prefix: r.token_prefix, createdAt: r.created_at, lastUsedAt: r.last_used_at, revokedAt: r.revoked_at }));
}

/** Revokes one of the user's own live tokens; false when there is none with that id. */
export async function revokeApiToken(trx: Db | Trx, userId: string, id: string): Promise<boolean> {
  const row = await trx
    .updateTable("api_tokens")
    .set({ revoked_at: new Date() })
    .where("id", "=", id)
    .where("user_id", "=", userId)
    .where("revoked_at", "is", null)
    .returning("id")
    .executeTakeFirst();
  return row !== undefined;
}
