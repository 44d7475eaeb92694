/**
 * Reads for impact previews and the slot finder: blocks on telescopes in a time range,
 * with the program (code, title, rank) and the observer, reshaped into ImpactBlock.
 */
import type { Db, Trx } from "@/db/index";
import type { ImpactBlock } from "./compute";

export interface TelescopeBlock extends ImpactBlock {
  telescopeId: string;
}

/** Blocks overlapping [from, to) on the given telescopes, in time order. */
export async function listImpactBlocks(db: Db | Trx, telescopeIds: readonly string[], from: Date, to: Date): Promise<TelescopeBlock[]> {
  if (telescopeIds.length === 0) return [];
  const rows = await db
    .selectFrom("blocks as b")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .leftJoin("users as o", "o.id", "b.observer_user_id")
    .select([
      "b.id",
      "b.telescope_id",
      "b.kind",
      "b.starts_at",
      "b.ends_at",
      "b.program_id",
      "p.code as program_code",
      "p.title as program_title",
      "p.rank as program_rank",
      "b.observer_user_id",
      "o.name as observer_name",
      "o.email as observer_email",
    ])
    .where("b.telescope_id", "in", [...telescopeIds])
    .where("b.ends_at", ">", from)
    .where("b.starts_at", "<", to)
    .orderBy("b.starts_at")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    telescopeId: r.telescope_id,
    start: r.starts_at.getTime(),
    end: r.ends_at.getTime(),
    kind: r.kind,
    programId: r.program_id,
    programCode: r.program_code,
    programTitle: r.program_title,
    programRank: r.program_rank,
    observerUserId: r.observer_user_id,
    observerName: r.observer_name,
    observerEmail: r.observer_email,
  }));
}

export interface ImpactTelescope {
  id: string;
  code: string;
  name: string;
  siteName: string;
  timeZone: string;
  setupMinutes: number;
}

/** A telescope by id or by code (case-insensitive). */
export async function findImpactTelescope(db: Db | Trx, ref: string): Promise<ImpactTelescope | undefined> {
  const isId = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i.test(ref);
  const query = db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "t.setup_minutes", "s.name as site_name", "s.time_zone"]);
  const row = await (isId ? query.where("t.id", "=", ref) : query.where((eb) => eb(eb.fn("upper", ["t.code"]), "=", ref.toUpperCase()))).executeTakeFirst();
  return row && { id: row.id, code: row.code, name: row.name, siteName: row.site_name, timeZone: row.time_zone, setupMinutes: row.setup_minutes };
}

/** Setup minutes per telescope (the time to break off and point at a new target). */
export async function listTelescopeSetupMinutes(db: Db | Trx, ids: readonly string[]): Promise<Map<string, number>> {
  if (ids.length === 0) return new Map();
  const rows = await db.selectFrom("telescopes").select(["id", "setup_minutes"]).where("id", "in", [...ids]).execute();
  return new Map(rows.map((r) => [r.id, r.setup_minutes]));
}
