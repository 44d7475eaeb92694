import type { Trx } from "@/db/index";
import type { NoticeEvent, Role } from "@/db/types";

export interface Recipient {
  userId: string;
  name: string;
  email: string;
  active: boolean;
  /** False only when the person turned e-mail off for this event (the default is on). */
  wantsEmail: boolean;
}

export async function findRecipients(trx: Trx, userIds: readonly string[], event: NoticeEvent): Promise<Recipient[]> {
  if (userIds.length === 0) return [];
  const rows = await trx
    .selectFrom("users as u")
    .leftJoin("notification_preferences as p", (join) => join.onRef("p.user_id", "=", "u.id").on("p.event", "=", event))
    .select(["u.id", "u.name", "u.email", "u.disabled_at", "p.email as pref"])
    .where("u.id", "in", userIds)
    .orderBy("u.id")
    .execute();
  return rows.map((r) => ({ userId: r.id, name: r.name, email: r.email, active: r.disabled_at === null, wantsEmail: r.pref !== false }));
}

export async function listActiveUserIdsWithRole(trx: Trx, role: Role): Promise<string[]> {
  const rows = await trx
    .selectFrom("users as u")
    .innerJoin("user_roles as r", "r.user_id", "u.id")
    .select("u.id")
    .where("r.role", "=", role)
    .where("u.disabled_at", "is", null)
    .execute();
  return rows.map((r) => r.id);
}

export async function listTelescopeAssistantIds(trx: Trx, telescopeId: string): Promise<string[]> {
  const rows = await trx
    .selectFrom("telescope_assistants as a")
    .innerJoin("users as u", "u.id", "a.user_id")
    .select("u.id")
    .where("a.telescope_id", "=", telescopeId)
    .where("u.disabled_at", "is", null)
    .execute();
  return rows.map((r) => r.id);
}
