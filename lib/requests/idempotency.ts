/**
 * Idempotency keys for the machine API: an alert pipeline that retries a POST with the
 * same `Idempotency-Key` gets the first answer again instead of filing twice. Keys are per
 * user. Requests with the same key are serialised by a transaction-scoped advisory lock,
 * and the key's row is written in the same transaction as the work it records, so a
 * failed attempt leaves no key behind and can simply be retried.
 */
import { createHash } from "node:crypto";
import { sql } from "kysely";
import { z } from "zod";
import type { Db, Trx } from "@/db/index";

export const IDEMPOTENCY_HEADER = "Idempotency-Key";

export const idempotencyKeySchema = z
  .string()
  .trim()
  .min(1, "The Idempotency-Key header is empty.")
  .max(255, "Keep the Idempotency-Key under 256 characters.")
  .regex(/^[\x21-\x7e]+$/, "Use printable ASCII without spaces in the Idempotency-Key.");

/** JSON with object keys sorted, so the same body written differently hashes the same. */
function canonical(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonical).join(",")}]`;
  if (value !== null && typeof value === "object") {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonical(v)}`).join(",")}}`;
  }
  return JSON.stringify(value) ?? "null";
}

export function requestHash(body: unknown): string {
  return createHash("sha256").update(canonical(body)).digest("hex");
}

export interface StoredAnswer {
  requestHash: string;
  statusCode: number;
  response: unknown;
}

export async function findStoredAnswer(db: Db | Trx, userId: string, key: string): Promise<StoredAnswer | undefined> {
  const row = await db
    .selectFrom("idempotency_keys")
    .select(["request_hash", "status_code", "response"])
    .where("user_id", "=", userId)
    .where("key", "=", key)
    .executeTakeFirst();
  return row && { requestHash: row.request_hash, statusCode: row.status_code, response: row.response };
}

/** Held until the transaction ends: a second request with the same key waits here. */
export async function lockKey(trx: Trx, userId: string, key: string): Promise<void> {
  await sql`select pg_advisory_xact_lock(hashtextextended(${`idem:${userId}:${key}`}, 0))`.execute(trx);
}

export async function storeAnswer(trx: Trx, userId: string, key: string, answer: StoredAnswer): Promise<void> {
  await trx
    .insertInto("idempotency_keys")
    .values({ user_id: userId, key, request_hash: answer.requestHash, status_code: answer.statusCode, response: JSON.stringify(answer.response) })
    .execute();
}
