/**
 * POST /api/v1/too-requests: validate, check, file, answer — with an optional
 * Idempotency-Key. The same key with the same body answers the first response again (and
 * files nothing); the same key with a different body is refused.
 */
import type { Db } from "@/db/index";
import { listAttachments } from "@/lib/attachments/queries";
import { toApiRequest, type ApiRequest } from "./api-shape";
import { IdempotencyConflictError } from "./errors";
import { findStoredAnswer, lockKey, requestHash, storeAnswer, type StoredAnswer } from "./idempotency";
import { findRequestById, listRequestEvents } from "./queries";
import { requestSchema } from "./schemas";
import { fileInTransaction, prepareFiling, type Actor } from "./service";

export interface ApiAnswer {
  status: number;
  body: unknown;
  replayed: boolean;
}

function replay(stored: StoredAnswer, hash: string): ApiAnswer {
  if (stored.requestHash !== hash) throw new IdempotencyConflictError();
  return { status: stored.statusCode, body: stored.response, replayed: true };
}

/** The coordinates as the caller wrote them, kept beside the parsed degrees. */
function typedCoordinates(body: unknown): { ra?: unknown; dec?: unknown } {
  const target = (body as { target?: { ra?: unknown; dec?: unknown } } | null)?.target;
  return target && typeof target === "object" ? { ra: target.ra, dec: target.dec } : {};
}

export async function fileFromApi(db: Db, actor: Actor, body: unknown, key: string | null, now = new Date()): Promise<ApiAnswer> {
  const hash = requestHash(body);
  if (key) {
    // A retry after success is answered without re-checking anything.
    const stored = await findStoredAnswer(db, actor.id, key);
    if (stored) return replay(stored, hash);
  }
  const input = requestSchema.parse(body);
  const prepared = await prepareFiling(db, actor, input, now, typedCoordinates(body));
  return db.transaction().execute(async (trx): Promise<ApiAnswer> => {
    if (key) {
      await lockKey(trx, actor.id, key);
      const stored = await findStoredAnswer(trx, actor.id, key);
      if (stored) return replay(stored, hash);
    }
    const id = await fileInTransaction(trx, actor, prepared, { source: "api", now });
    const request = await findRequestById(trx, id);
    if (!request) throw new Error("a request vanished inside its own transaction");
    const answer: { request: ApiRequest } = { request: toApiRequest(request, await listRequestEvents(trx, id), await listAttachments(trx, id)) };
    if (key) await storeAnswer(trx, actor.id, key, { requestHash: hash, statusCode: 201, response: answer });
    return { status: 201, body: answer, replayed: false };
  });
}
