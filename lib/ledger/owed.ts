/**
 * What an observer is owed, for their home page: per program they observe or lost time
 * on, the program's balance on the ledger, the minutes displaced from their own blocks,
 * and the next payback block already scheduled for the program.
 */
import type { Db } from "@/db/index";
import { owedOf } from "./balances";
import { listLedgerRows } from "./queries";

export interface ObserverOwed {
  programId: string;
  programCode: string;
  programTitle: string;
  semesterCode: string;
  yourDisplacedMinutes: number;
  creditedMinutes: number;
  repaidMinutes: number;
  owedMinutes: number;
  nextPayback: { startsAt: Date; endsAt: Date; telescopeCode: string } | null;
}

async function observedProgramIds(db: Db, userId: string): Promise<string[]> {
  const rows = await db
    .selectFrom("program_observers")
    .select("program_id")
    .where("user_id", "=", userId)
    .union(db.selectFrom("displacements").select("program_id").where("observer_user_id", "=", userId))
    .execute();
  return rows.map((r) => r.program_id);
}

export async function listOwedToObserver(db: Db, userId: string, now: Date): Promise<ObserverOwed[]> {
  const ids = await observedProgramIds(db, userId);
  const rows = (await listLedgerRows(db, { programIds: ids })).filter((r) => r.creditedMinutes > 0);
  if (rows.length === 0) return [];
  const programIds = rows.map((r) => r.programId);
  const [displaced, paybacks] = await Promise.all([
    db
      .selectFrom("displacements")
      .select(["program_id", (eb) => eb.fn.sum<number>("minutes").as("minutes")])
      .where("observer_user_id", "=", userId)
      .where("program_id", "in", programIds)
      .groupBy("program_id")
      .execute(),
    db
      .selectFrom("blocks as b")
      .innerJoin("telescopes as t", "t.id", "b.telescope_id")
      .select(["b.program_id", "b.starts_at", "b.ends_at", "t.code"])
      .where("b.kind", "=", "payback")
      .where("b.program_id", "in", programIds)
      .where("b.ends_at", ">", now)
      .orderBy("b.starts_at")
      .execute(),
  ]);
  return rows
    .map((r) => {
      const next = paybacks.find((p) => p.program_id === r.programId);
      return {
        programId: r.programId,
        programCode: r.programCode,
        programTitle: r.programTitle,
        semesterCode: r.semesterCode,
        yourDisplacedMinutes: Number(displaced.find((d) => d.program_id === r.programId)?.minutes ?? 0),
        creditedMinutes: r.creditedMinutes,
        repaidMinutes: r.repaidMinutes,
        owedMinutes: owedOf(r),
        nextPayback: next ? { startsAt: next.starts_at, endsAt: next.ends_at, telescopeCode: next.code } : null,
      };
    })
    .sort((a, b) => b.owedMinutes - a.owedMinutes || a.programCode.localeCompare(b.programCode));
}
