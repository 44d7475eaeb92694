/**
 * Acknowledging changes: "I have seen every change on this telescope up to this one."
 * The person names the last change they saw, so a change that arrived after their page
 * last refreshed is never acknowledged on their behalf.
 */
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { canOperate } from "./access";
import { TonightFieldError, TonightForbiddenError, TonightNotFoundError } from "./errors";
import { findLastAcknowledgement, findLatestChangeId, findTelescopeByRef, insertAcknowledgement, isTelescopeAssistant } from "./queries";
import type { Viewer } from "./queue";
import type { AcknowledgeInput } from "./schemas";
import type { QueueAcknowledgement } from "./types";
import { forgetNightSnapshots } from "./night-snapshots";

export async function acknowledgeChanges(db: Db, actor: Viewer & { name: string }, telescopeRef: string, input: AcknowledgeInput): Promise<QueueAcknowledgement> {
  const acknowledged = await db.transaction().execute(async (trx) => {
    const telescope = await findTelescopeByRef(trx, telescopeRef);
    if (!telescope) throw new TonightNotFoundError(`There is no telescope "${telescopeRef}".`);
    if (!canOperate(actor.roles, await isTelescopeAssistant(trx, telescope.id, actor.id))) {
      throw new TonightForbiddenError(`Only the night assistants of ${telescope.code} (and admins) acknowledge its changes.`);
    }
    const latest = await findLatestChangeId(trx, telescope.id);
    if (latest === null || input.throughChangeId > latest) {
      throw new TonightFieldError("throughChangeId", `There is no change ${input.throughChangeId} on ${telescope.code}: reload the queue and look again.`);
    }
    const previous = await findLastAcknowledgement(trx, telescope.id, actor.id);
    // Already seen: answer with what stands rather than writing a step backwards.
    if (previous && previous.throughChangeId >= input.throughChangeId) return previous;
    const at = await insertAcknowledgement(trx, { telescopeId: telescope.id, userId: actor.id, throughChangeId: input.throughChangeId });
    await writeAudit(trx, {
      actorUserId: actor.id,
      action: "tonight.acknowledge",
      entity: "telescope",
      entityId: telescope.id,
      details: { throughChangeId: input.throughChangeId, previous: previous?.throughChangeId ?? null },
    });
    return { userName: actor.name, at: at.toISOString(), throughChangeId: input.throughChangeId };
  });
  forgetNightSnapshots();
  return acknowledged;
}
