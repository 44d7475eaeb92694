/**
 * Bearer tokens seen in the last second, so a pipeline or an open page polling with one
 * token does not read the database on every call (on this kind of machine each query's
 * socket write costs more than the rest of a small answer). Revoking a token or changing
 * a user's roles through this process forgets them at once; through another app instance
 * the change holds within TOKEN_REUSE_MS. Unknown and revoked tokens are never kept.
 */
import type { Db } from "@/db/index";
import { processShared } from "@/lib/process-shared";
import type { User } from "@/lib/users/queries";
import { findUserByToken, hashToken } from "./queries";

export const TOKEN_REUSE_MS = 1000;
const MAX_ENTRIES = 1000;
const entries = processShared("token-users", () => new Map<string, { at: number; user: User }>());

export async function userByTokenReused(db: Db, token: string, now = Date.now()): Promise<User | undefined> {
  const key = hashToken(token);
  const hit = entries.get(key);
  if (hit && now - hit.at <= TOKEN_REUSE_MS) return hit.user;
  const user = await findUserByToken(db, token);
  if (!user) {
    entries.delete(key);
    return undefined;
  }
  if (entries.size >= MAX_ENTRIES) entries.delete(entries.keys().next().value ?? "");
  entries.set(key, { at: now, user });
  return user;
}

/** After a token is revoked or a user's roles change: the next call reads the database. */
export function forgetTokenUsers(): void {
  entries.clear();
}
