/**
 * Reads for the calendar and the schedule API: blocks in a time range with everything a
 * person needs to recognise them, and one block's detail with its history.
 */
import type { Db } from "@/db/index";
import type { BlockKind } from "@/db/types";

export interface CalendarBlock {
  id: string;
  kind: BlockKind;
  startsAt: string;
  endsAt: string;
  telescopeId: string;
  programId: string;
  programCode: string;
  programTitle: string;
  piName: string;
  observerUserId: string | null;
  observerName: string | null;
  instrumentId: string | null;
  instrumentCode: string | null;
}

function calendarBlocksQuery(db: Db) {
  return db
    .selectFrom("blocks as b")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .innerJoin("users as pi", "pi.id", "p.pi_user_id")
    .leftJoin("users as o", "o.id", "b.observer_user_id")
    .leftJoin("instruments as i", "i.id", "b.instrument_id")
    .select([
      "b.id",
      "b.kind",
      "b.starts_at",
      "b.ends_at",
      "b.telescope_id",
      "b.program_id",
      "p.code as program_code",
      "p.title as program_title",
      "pi.name as pi_name",
      "b.observer_user_id",
      "o.name as observer_name",
      "b.instrument_id",
      "i.code as instrument_code",
      "i.name as instrument_name",
      "b.notes",
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof calendarBlocksQuery>["execute"]>>[number];

function toCalendarBlock(r: Row): CalendarBlock {
  return {
    id: r.id,
    kind: r.kind,
    startsAt: r.starts_at.toISOString(),
    endsAt: r.ends_at.toISOString(),
    telescopeId: r.telescope_id,
    programId: r.program_id,
    programCode: r.program_code,
    programTitle: r.program_title,
    piName: r.pi_name,
    observerUserId: r.observer_user_id,
    observerName: r.observer_name,
    instrumentId: r.instrument_id,
    instrumentCode: r.instrument_code,
  };
}

export async function listCalendarBlocks(db: Db, range: { telescopeId?: string; from: Date; to: Date }): Promise<CalendarBlock[]> {
  let q = calendarBlocksQuery(db).where("b.ends_at", ">", range.from).where("b.starts_at", "<", range.to);
  if (range.telescopeId) q = q.where("b.telescope_id", "=", range.telescopeId);
  const rows = await q.orderBy("b.telescope_id").orderBy("b.starts_at").execute();
  return rows.map(toCalendarBlock);
}

export interface BlockHistoryEntry {
  at: string;
  action: string;
  actorName: string | null;
  details: unknown;
}

export interface BlockDetail extends CalendarBlock {
  telescopeName: string;
  siteName: string;
  timeZone: string;
  instrumentName: string | null;
  notes: string;
  history: BlockHistoryEntry[];
}

export async function getBlockDetail(db: Db, id: string): Promise<BlockDetail | undefined> {
  const row = await calendarBlocksQuery(db)
    .innerJoin("telescopes as t", "t.id", "b.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.name as telescope_name", "s.name as site_name", "s.time_zone"])
    .where("b.id", "=", id)
    .executeTakeFirst();
  if (!row) return undefined;
  const history = await db
    .selectFrom("audit_log as a")
    .leftJoin("users as u", "u.id", "a.actor_user_id")
    .select(["a.at", "a.action", "u.name as actor_name", "a.details"])
    .where("a.entity", "=", "block")
    .where("a.entity_id", "=", id)
    .orderBy("a.at")
    .execute();
  return {
    ...toCalendarBlock(row),
    telescopeName: row.telescope_name,
    siteName: row.site_name,
    timeZone: row.time_zone,
    instrumentName: row.instrument_name,
    notes: row.notes,
    history: history.map((h) => ({ at: h.at.toISOString(), action: h.action, actorName: h.actor_name, details: h.details })),
  };
}

export interface CalendarTelescope {
  id: string;
  code: string;
  name: string;
  siteId: string;
  siteName: string;
  timeZone: string;
  latitudeDeg: number;
  longitudeDeg: number;
  heightM: number;
}

export async function listCalendarTelescopes(db: Db): Promise<CalendarTelescope[]> {
  const rows = await db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "s.id as site_id", "s.name as site_name", "s.time_zone", "s.latitude_deg", "s.longitude_deg", "s.height_m"])
    .orderBy("t.code")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    name: r.name,
    siteId: r.site_id,
    siteName: r.site_name,
    timeZone: r.time_zone,
    latitudeDeg: r.latitude_deg,
    longitudeDeg: r.longitude_deg,
    heightM: r.height_m,
  }));
}
