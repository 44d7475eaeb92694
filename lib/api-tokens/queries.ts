import { createHash } from "node:crypto";
import type { Db } from "@/db/index";
import { findUserById, type User } from "@/lib/users/queries";

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}

/** The user behind a bearer token, or undefined when the token is unknown, revoked or its user disabled. */
export async function findUserByToken(db: Db, token: string): Promise<User | undefined> {
  const row = await db
    .updateTable("api_tokens")
    .set({ last_used_at: new Date() })
    .where("token_hash", "=", hashToken(token))
    .where("revoked_at", "is", null)
    .returning("user_id")
    .executeTakeFirst();
  if (!row) return undefined;
  const user = await findUserById(db, row.user_id);
  return user && !user.disabled ? user : undefined;
}
