/** The decision on a request as the review page shows it once made. */
import type { Db } from "@/db/index";
import type { Decision } from "@/db/types";

export interface DecisionRecord {
  decision: Decision;
  note: string;
  decidedAt: Date;
  decidedBy: string;
  slot: { telescopeCode: string; telescopeName: string; timeZone: string; start: Date; end: Date } | null;
  displacedMinutes: number;
}

export async function findLatestDecision(db: Db, requestId: string): Promise<DecisionRecord | undefined> {
  const row = await db
    .selectFrom("request_decisions as d")
    .innerJoin("users as u", "u.id", "d.decided_by")
    .leftJoin("telescopes as t", "t.id", "d.telescope_id")
    .leftJoin("sites as s", "s.id", "t.site_id")
    .select(["d.decision", "d.note", "d.decided_at", "u.name", "t.code", "t.name as telescope_name", "s.time_zone", "d.slot_start", "d.slot_end"])
    .where("d.request_id", "=", requestId)
    .orderBy("d.decided_at", "desc")
    .executeTakeFirst();
  if (!row) return undefined;
  const displaced = await db.selectFrom("displacements").select((eb) => eb.fn.coalesce(eb.fn.sum<number>("minutes"), eb.lit(0)).as("minutes")).where("request_id", "=", requestId).executeTakeFirst();
  return {
    decision: row.decision,
    note: row.note,
    decidedAt: row.decided_at,
    decidedBy: row.name,
    slot:
      row.code && row.slot_start && row.slot_end
        ? { telescopeCode: row.code, telescopeName: row.telescope_name ?? row.code, timeZone: row.time_zone ?? "UTC", start: row.slot_start, end: row.slot_end }
        : null,
    displacedMinutes: Number(displaced?.minutes ?? 0),
  };
}
