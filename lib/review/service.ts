/**
 * The director's side of a request beyond the decision itself: opening a submitted
 * request for review moves it to `in_review`, so the PI sees that someone is on it.
 */
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import type { User } from "@/lib/users/queries";

export async function markInReview(db: Db, director: Pick<User, "id">, requestId: string): Promise<boolean> {
  return db.transaction().execute(async (trx) => {
    const row = await trx.selectFrom("too_requests").select(["id", "state"]).where("id", "=", requestId).forUpdate().executeTakeFirst();
    if (!row || row.state !== "submitted") return false;
    await trx.updateTable("too_requests").set({ state: "in_review", updated_at: new Date() }).where("id", "=", requestId).execute();
    await trx.insertInto("request_events").values({ request_id: requestId, actor_user_id: director.id, from_state: "submitted", to_state: "in_review", note: "Opened for review." }).execute();
    await writeAudit(trx, { actorUserId: director.id, action: "request.review", entity: "too_request", entityId: requestId });
    return true;
  });
}
