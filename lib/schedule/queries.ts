import type { Db } from "@/db/index";
import type { BlockKind } from "@/db/types";

export interface ScheduledBlock {
  id: string;
  kind: BlockKind;
  startsAt: Date;
  endsAt: Date;
  telescope: { id: string; code: string; name: string; timeZone: string };
  program: { id: string; code: string; title: string };
  observerName: string | null;
}

function blocksQuery(db: Db) {
  return db
    .selectFrom("blocks as b")
    .innerJoin("telescopes as t", "t.id", "b.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .leftJoin("users as o", "o.id", "b.observer_user_id")
    .select([
      "b.id",
      "b.kind",
      "b.starts_at",
      "b.ends_at",
      "t.id as telescope_id",
      "t.code as telescope_code",
      "t.name as telescope_name",
      "s.time_zone",
      "p.id as program_id",
      "p.code as program_code",
      "p.title as program_title",
      "o.name as observer_name",
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof blocksQuery>["execute"]>>[number];

function toBlock(r: Row): ScheduledBlock {
  return {
    id: r.id,
    kind: r.kind,
    startsAt: r.starts_at,
    endsAt: r.ends_at,
    telescope: { id: r.telescope_id, code: r.telescope_code, name: r.telescope_name, timeZone: r.time_zone },
    program: { id: r.program_id, code: r.program_code, title: r.program_title },
    observerName: r.observer_name,
  };
}

/** Blocks overlapping [from, to) observed by one user, in time order. */
export async function listBlocksForObserver(db: Db, userId: string, from: Date, to: Date, limit = 20): Promise<ScheduledBlock[]> {
  const rows = await blocksQuery(db)
    .where("b.observer_user_id", "=", userId)
    .where("b.ends_at", ">", from)
    .where("b.starts_at", "<", to)
    .orderBy("b.starts_at")
    .limit(limit)
    .execute();
  return rows.map(toBlock);
}

/** Blocks overlapping [from, to) on the given telescopes, in time order. */
export async function listBlocksOnTelescopes(db: Db, telescopeIds: string[], from: Date, to: Date): Promise<ScheduledBlock[]> {
  if (!telescopeIds.length) return [];
  const rows = await blocksQuery(db)
    .where("b.telescope_id", "in", telescopeIds)
    .where("b.ends_at", ">", from)
    .where("b.starts_at", "<", to)
    .orderBy("b.starts_at")
    .execute();
  return rows.map(toBlock);
}

/** Blocks on a telescope overlapping [start, end), optionally ignoring one block (the one being moved). */
export async function findOverlappingBlocks(db: Db, telescopeId: string, start: Date, end: Date, exceptId?: string): Promise<ScheduledBlock[]> {
  let q = blocksQuery(db).where("b.telescope_id", "=", telescopeId).where("b.ends_at", ">", start).where("b.starts_at", "<", end);
  if (exceptId) q = q.where("b.id", "!=", exceptId);
  const rows = await q.orderBy("b.starts_at").execute();
  return rows.map(toBlock);
}
