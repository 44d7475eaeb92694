/**
 * The night log: what happened to a block. For a ToO block the logged outcome settles the
 * request (executed, partially executed or not executed) in the same transaction, with a
 * request event, audit rows and a notice to the PI. A later log of the same block corrects
 * the earlier one (and tells the PI again).
 */
import type { Db, Trx } from "@/db/index";
import type { RequestState } from "@/db/types";
import { writeAudit } from "@/lib/audit/queries";
import { noticeOutcomeLogged } from "@/lib/notices/notify";
import { insertRequestEvent, lockRequest, setRequestState } from "@/lib/requests/queries";
import { formatUt } from "@/lib/time/format";
import { canOperate } from "./access";
import { TonightFieldError, TonightForbiddenError, TonightNotFoundError } from "./errors";
import { OUTCOME_LABELS, SETTLED_STATE } from "./labels";
import { findTelescopeByRef, insertBlockExecution, isTelescopeAssistant, loadOutcomeNoticeFacts, lockBlockForLog, type LockedBlock } from "./queries";
import type { Viewer } from "./queue";
import type { ExecutionLogInput } from "./schemas";
import { forgetNightSnapshots } from "./night-snapshots";

/** States from which a logged outcome may settle (or re-settle) a request. */
const SETTLEABLE: readonly RequestState[] = ["approved", "executed", "partially_executed", "not_executed"];
const MINUTE = 60_000;
const LOG_AHEAD_MS = 24 * 3_600_000;

export interface LoggedExecution {
  id: string;
  blockId: string;
  loggedAt: string;
  /** The ToO request's state change, when the block is a ToO block and its request could be settled. */
  request: { id: string; from: RequestState; to: RequestState } | null;
}

function checkTiming(block: LockedBlock, input: ExecutionLogInput, now: Date): void {
  const started = now >= block.startsAt;
  if ((input.outcome === "executed" || input.outcome === "partial") && !started) {
    throw new TonightFieldError("outcome", `This block has not started yet (${formatUt(block.startsAt)} UT): it cannot have been observed.`);
  }
  if (block.startsAt.getTime() - now.getTime() > LOG_AHEAD_MS) {
    throw new TonightFieldError("outcome", "This block is more than a day away: log its outcome on the night.");
  }
  const scheduled = Math.round((block.endsAt.getTime() - block.startsAt.getTime()) / MINUTE);
  if (input.minutesUsed !== null && input.minutesUsed > scheduled) {
    throw new TonightFieldError("minutesUsed", `The block is ${scheduled} minutes long: at most ${scheduled} minutes can have been used.`);
  }
}

async function settleRequest(
  trx: Trx,
  actorId: string,
  requestId: string,
  input: ExecutionLogInput,
  block: LockedBlock,
  logged: { id: string; loggedAt: Date },
): Promise<LoggedExecution["request"]> {
  const blockId = block.id;
  const request = await lockRequest(trx, requestId);
  // A block whose request is elsewhere in its life (withdrawn after approval, say) keeps its
  // log; the request's own history is not rewritten from the night log.
  if (!request || !SETTLEABLE.includes(request.state)) return null;
  const to = SETTLED_STATE[input.outcome];
  const minutes = input.minutesUsed === null ? "" : `, ${input.minutesUsed} min`;
  const note = `Night log: ${OUTCOME_LABELS[input.outcome].toLowerCase()}${minutes}${input.note ? ` — ${input.note}` : ""}`.slice(0, 2000);
  if (request.state !== to) await setRequestState(trx, requestId, to);
  await insertRequestEvent(trx, { requestId, actorUserId: actorId, from: request.state, to, note });
  await writeAudit(trx, {
    actorUserId: actorId,
    action: "request.settle",
    entity: "too_request",
    entityId: requestId,
    details: { from: request.state, to, blockId, outcome: input.outcome, minutesUsed: input.minutesUsed },
  });
  // The PI hears what happened (above all a ToO lost to weather or a fault), in this
  // transaction: a rolled-back log tells nobody. Each log, a correction included, is a notice.
  const facts = await loadOutcomeNoticeFacts(trx, { requestId, blockId, actorId });
  if (facts) {
    await noticeOutcomeLogged(trx, {
      executionId: logged.id,
      requestId,
      piUserId: request.piUserId,
      ...facts,
      block: { startsAt: block.startsAt, endsAt: block.endsAt },
      outcome: input.outcome,
      minutesUsed: input.minutesUsed,
      note: input.note,
      requestState: to,
      loggedAt: logged.loggedAt,
    });
  }
  // The ledger is left as the approval booked it, whatever the outcome: the displaced
  // programs lost their time either way, and the ToO program was given the night. A
  // consortium that refunds weather losses would add that rule in lib/ledger, called here.
  return { id: requestId, from: request.state, to };
}

export async function logExecution(db: Db, actor: Viewer, blockId: string, input: ExecutionLogInput, now = new Date()): Promise<LoggedExecution> {
  const result = await db.transaction().execute(async (trx) => {
    const block = await lockBlockForLog(trx, blockId);
    if (!block) throw new TonightNotFoundError("That block no longer exists: the schedule may have changed. Reload the queue.");
    const assigned = await isTelescopeAssistant(trx, block.telescopeId, actor.id);
    if (!canOperate(actor.roles, assigned)) {
      const telescope = await findTelescopeByRef(trx, block.telescopeId);
      throw new TonightForbiddenError(`Only the night assistants of ${telescope?.code ?? "this telescope"} (and admins) log its blocks.`);
    }
    checkTiming(block, input, now);
    const logged = await insertBlockExecution(trx, { blockId, outcome: input.outcome, minutesUsed: input.minutesUsed, note: input.note, loggedBy: actor.id });
    await writeAudit(trx, {
      actorUserId: actor.id,
      action: "block.execution",
      entity: "block",
      entityId: blockId,
      details: { outcome: input.outcome, minutesUsed: input.minutesUsed, note: input.note },
    });
    const request = block.tooRequestId ? await settleRequest(trx, actor.id, block.tooRequestId, input, block, logged) : null;
    return { id: logged.id, blockId, loggedAt: logged.loggedAt.toISOString(), request };
  });
  forgetNightSnapshots();
  return result;
}
