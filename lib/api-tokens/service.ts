/**
 * Personal API tokens. The secret is shown once, at creation, and stored only as a SHA-256
 * hash; the first characters stay visible so a person can tell their tokens apart. A token
 * carries its owner's roles (lib/api/handler.ts looks the owner up on every call), so
 * revoking it, or disabling the owner, ends its use at once. Creation is rate-limited.
 */
import { randomBytes } from "node:crypto";
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { consumeAttempt } from "@/lib/auth/rate-limit";
import { hashToken, insertApiToken, revokeApiToken, type ApiToken } from "./queries";
import { forgetTokenUsers } from "./token-cache";

export const TOKEN_PREFIX = "nbk_";
const VISIBLE = TOKEN_PREFIX.length + 8;
const ALPHABET = "ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789";

/** 40 characters from a 62-letter alphabet: about 238 bits. */
export function generateTokenSecret(): string {
  const bytes = randomBytes(64);
  let out = "";
  for (const b of bytes) {
    // 248 = 4 × 62: rejecting higher bytes keeps every letter equally likely.
    if (b < 248) out += ALPHABET[b % 62];
    if (out.length === 40) break;
  }
  return out.length === 40 ? `${TOKEN_PREFIX}${out}` : generateTokenSecret();
}

export class TokenNotFoundError extends Error {
  constructor() {
    super("That token does not exist or has already been revoked.");
  }
}

export async function createApiToken(db: Db, userId: string, name: string): Promise<{ token: ApiToken; secret: string }> {
  await consumeAttempt("token-create", userId);
  const secret = generateTokenSecret();
  return db.transaction().execute(async (trx) => {
    const token = await insertApiToken(trx, { userId, name, prefix: secret.slice(0, VISIBLE), hash: hashToken(secret) });
    await writeAudit(trx, { actorUserId: userId, action: "api_token.create", entity: "api_token", entityId: token.id, details: { name, prefix: token.prefix } });
    return { token, secret };
  });
}

export async function revokeOwnApiToken(db: Db, userId: string, id: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    if (!(await revokeApiToken(trx, userId, id))) throw new TokenNotFoundError();
    await writeAudit(trx, { actorUserId: userId, action: "api_token.revoke", entity: "api_token", entityId: id });
  });
  forgetTokenUsers();
}
