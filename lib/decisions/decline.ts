/**
 * Declining a request (a reason is required) or returning it to the PI for changes: the
 * request goes back to a draft with the director's note, and the PI can file it again.
 * Either way the PI is told (in-app notice and e-mail) in the same transaction.
 */
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { noticeDecisionMade, noticeRequestReturned } from "@/lib/notices/notify";
import type { User } from "@/lib/users/queries";
import { loadFirstSite } from "./context";
import { DecisionError } from "./errors";
import { lockRequestForDecision } from "./request-row";

const OPEN = ["submitted", "in_review"];

export async function declineRequest(db: Db, director: User, input: { requestId: string; reason: string }): Promise<void> {
  const reason = input.reason.trim();
  if (!reason) throw new DecisionError("Give the PI a reason for declining.", 400);
  await db.transaction().execute(async (trx) => {
    const request = await lockRequestForDecision(trx, input.requestId);
    if (!request) throw new DecisionError("No such request.", 404);
    if (request.state === "declined") return;
    if (!OPEN.includes(request.state)) throw new DecisionError(`This request is ${request.state.replace("_", " ")}: it can no longer be declined.`, 409);
    await trx.updateTable("too_requests").set({ state: "declined", director_note: reason, updated_at: new Date() }).where("id", "=", request.id).execute();
    await trx.insertInto("request_events").values({ request_id: request.id, actor_user_id: director.id, from_state: request.state, to_state: "declined", note: reason }).execute();
    await trx.insertInto("request_decisions").values({ request_id: request.id, decision: "decline", note: reason, decided_by: director.id }).execute();
    await writeAudit(trx, { actorUserId: director.id, action: "request.decline", entity: "too_request", entityId: request.id, details: { reason } });
    await noticeDecisionMade(trx, {
      requestId: request.id,
      piUserId: request.pi_user_id,
      targetName: request.target_name,
      programCode: request.program_code ?? "ToO",
      decision: "declined",
      reason,
      decidedBy: { name: director.name, email: director.email },
      decidedAt: new Date(),
      site: await loadFirstSite(trx, request.id),
      slot: null,
      displacedMinutes: 0,
    });
  });
}

export async function returnRequest(db: Db, director: User, input: { requestId: string; note: string }): Promise<void> {
  const note = input.note.trim();
  if (!note) throw new DecisionError("Tell the PI what to change.", 400);
  await db.transaction().execute(async (trx) => {
    const request = await lockRequestForDecision(trx, input.requestId);
    if (!request) throw new DecisionError("No such request.", 404);
    if (!OPEN.includes(request.state)) throw new DecisionError(`This request is ${request.state.replace("_", " ")}: it cannot be returned.`, 409);
    // Back to a draft: the PI edits and files again; the note stays visible on the request.
    await trx.updateTable("too_requests").set({ state: "draft", submitted_at: null, director_note: note, updated_at: new Date() }).where("id", "=", request.id).execute();
    await trx.insertInto("request_events").values({ request_id: request.id, actor_user_id: director.id, from_state: request.state, to_state: "draft", note }).execute();
    const decision = await trx
      .insertInto("request_decisions")
      .values({ request_id: request.id, decision: "return", note, decided_by: director.id })
      .returning(["id", "decided_at"])
      .executeTakeFirstOrThrow();
    await writeAudit(trx, { actorUserId: director.id, action: "request.return", entity: "too_request", entityId: request.id, details: { note } });
    await noticeRequestReturned(trx, {
      returnId: decision.id,
      requestId: request.id,
      piUserId: request.pi_user_id,
      targetName: request.target_name,
      programCode: request.program_code ?? "ToO",
      note,
      returnedBy: { name: director.name, email: director.email },
      returnedAt: decision.decided_at,
      deadline: request.urgency === "within_days" ? request.deadline : null,
      site: await loadFirstSite(trx, request.id),
    });
  });
}
