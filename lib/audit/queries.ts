import type { Db, Trx } from "@/db/index";

export interface AuditEntry {
  actorUserId: string | null;
  action: string;
  entity: string;
  entityId: string | null;
  details?: Record<string, unknown>;
}

/** Audit rows are written in the same transaction as the change they describe. */
export async function writeAudit(trx: Trx | Db, entry: AuditEntry): Promise<void> {
  await trx
    .insertInto("audit_log")
    .values({
      actor_user_id: entry.actorUserId,
      action: entry.action,
      entity: entry.entity,
      entity_id: entry.entityId,
      details: JSON.stringify(entry.details ?? {}),
    })
    .execute();
}
