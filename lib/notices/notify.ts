/**
 * One function per event, for the capabilities that cause them. Call inside the
 * transaction that makes the change; each finds its own recipients:
 *
 *   await db.transaction().execute(async (trx) => {
 *     ...approve the request, splice the schedule...
 *     await noticeDecisionMade(trx, { requestId, piUserId, decision: "approved", ... });
 *     for (const d of displacements) await noticeBlockDisplaced(trx, { ... });
 *   });
 */
import type { Trx } from "@/db/index";
import { enqueueNotice, type EnqueueResult } from "./enqueue";
import type {
  BlockDisplacedPayload,
  DecisionMadePayload,
  OutcomeLoggedPayload,
  PaybackScheduledPayload,
  RequestLapsedPayload,
  RequestReturnedPayload,
  RequestSubmittedPayload,
  TonightChangedPayload,
} from "./events";
import { listActiveUserIdsWithRole, listTelescopeAssistantIds } from "./recipients";

/** To every active director. */
export async function noticeRequestSubmitted(trx: Trx, payload: RequestSubmittedPayload): Promise<EnqueueResult> {
  const recipientIds = await listActiveUserIdsWithRole(trx, "director");
  return enqueueNotice(trx, { event: "request_submitted", payload, subjectId: payload.requestId, recipientIds });
}

/** To the request's PI (`payload.piUserId`). */
export async function noticeDecisionMade(trx: Trx, payload: DecisionMadePayload): Promise<EnqueueResult> {
  return enqueueNotice(trx, { event: "decision_made", payload, subjectId: payload.requestId, recipientIds: [payload.piUserId] });
}

/** To the displaced block's observer (`payload.observerUserId`); one call per displacement. */
export async function noticeBlockDisplaced(trx: Trx, payload: BlockDisplacedPayload): Promise<EnqueueResult> {
  return enqueueNotice(trx, { event: "block_displaced", payload, subjectId: payload.displacementId, recipientIds: [payload.observerUserId] });
}

/** To the active night assistants of `payload.telescopeId`; `changeId` names this change. */
export async function noticeTonightChanged(trx: Trx, payload: TonightChangedPayload): Promise<EnqueueResult> {
  const recipientIds = await listTelescopeAssistantIds(trx, payload.telescopeId);
  return enqueueNotice(trx, { event: "tonight_changed", payload, subjectId: payload.changeId, recipientIds });
}

/** To the payback block's observer (`payload.observerUserId`). */
export async function noticePaybackScheduled(trx: Trx, payload: PaybackScheduledPayload): Promise<EnqueueResult> {
  return enqueueNotice(trx, { event: "payback_scheduled", payload, subjectId: payload.paybackBlockId, recipientIds: [payload.observerUserId] });
}

/** To the request's PI (`payload.piUserId`); one notice per night-log entry (`executionId`). */
export async function noticeOutcomeLogged(trx: Trx, payload: OutcomeLoggedPayload): Promise<EnqueueResult> {
  return enqueueNotice(trx, { event: "outcome_logged", payload, subjectId: payload.executionId, recipientIds: [payload.piUserId] });
}

/** To the request's PI (`payload.piUserId`); a request lapses once, so one notice per request. */
export async function noticeRequestLapsed(trx: Trx, payload: RequestLapsedPayload): Promise<EnqueueResult> {
  return enqueueNotice(trx, { event: "request_lapsed", payload, subjectId: payload.requestId, recipientIds: [payload.piUserId] });
}

/** To the request's PI (`payload.piUserId`); one notice per return (`returnId`), so a second return after refiling is told too. */
export async function noticeRequestReturned(trx: Trx, payload: RequestReturnedPayload): Promise<EnqueueResult> {
  return enqueueNotice(trx, { event: "request_returned", payload, subjectId: payload.returnId, recipientIds: [payload.piUserId] });
}
