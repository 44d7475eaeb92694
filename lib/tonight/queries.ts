/**
 * Reads and writes behind tonight's queue (Kysely only). Rows become the app's own types
 * here; functions taking `trx: Trx` run inside the caller's transaction.
 */
import { sql } from "kysely";
import { jsonArrayFrom } from "kysely/helpers/postgres";
import type { Db, Trx } from "@/db/index";
import type { BlockKind, DarknessLevel, ExecutionOutcome, RequestState, StoredEphemerisRow, TargetKind } from "@/db/types";
import type { Site } from "@/lib/sky";
import type { QueueAcknowledgement, QueueAttachment, QueueChange, QueueExecution } from "./types";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** An instant as the ISO string the app passes around ("…T23:30:00.000Z"), built in SQL so JSON rows carry it ready. */
function iso(column: string) {
  return sql<string>`to_char(${sql.ref(column)} at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`;
}

export interface QueueTelescopeRow {
  id: string;
  code: string;
  name: string;
  siteName: string;
  site: Site & { timeZone: string };
  maxAirmass: number;
  minAltitudeDeg: number;
}

/** A telescope by uuid or by code (codes case-insensitively). */
export async function findTelescopeByRef(db: Db | Trx, ref: string): Promise<QueueTelescopeRow | undefined> {
  const q = db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "t.max_airmass", "t.min_altitude_deg", "s.name as site_name", "s.time_zone", "s.latitude_deg", "s.longitude_deg", "s.height_m"]);
  const r = await (UUID.test(ref) ? q.where("t.id", "=", ref) : q.where(sql<string>`upper(t.code)`, "=", ref.toUpperCase())).executeTakeFirst();
  if (!r) return undefined;
  return {
    id: r.id,
    code: r.code,
    name: r.name,
    siteName: r.site_name,
    site: { latitudeDeg: r.latitude_deg, longitudeDeg: r.longitude_deg, heightM: r.height_m, timeZone: r.time_zone },
    maxAirmass: r.max_airmass,
    minAltitudeDeg: r.min_altitude_deg,
  };
}

export async function isTelescopeAssistant(db: Db | Trx, telescopeId: string, userId: string): Promise<boolean> {
  const row = await db.selectFrom("telescope_assistants").select("user_id").where("telescope_id", "=", telescopeId).where("user_id", "=", userId).executeTakeFirst();
  return row !== undefined;
}

export interface QueueBlockRow {
  id: string;
  kind: BlockKind;
  startsAt: string;
  endsAt: string;
  programCode: string;
  programTitle: string;
  observerName: string | null;
  instrumentCode: string | null;
  instrumentName: string | null;
  execution: QueueExecution | null;
  too: {
    requestId: string;
    state: RequestState;
    targetName: string;
    targetKind: TargetKind;
    raDeg: number | null;
    decDeg: number | null;
    raText: string;
    decText: string;
    /** The rows within a few days of the night (the whole table can be long). */
    ephemeris: StoredEphemerisRow[] | null;
    ephemerisRows: number;
    justification: string;
    darkness: DarknessLevel;
    attachments: QueueAttachment[];
  } | null;
}

function blocksQuery(db: Db | Trx, telescopeId: string, from: Date, to: Date) {
  return db
    .selectFrom("blocks as b")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .leftJoin("users as o", "o.id", "b.observer_user_id")
    .leftJoin("instruments as i", "i.id", "b.instrument_id")
    .leftJoin("too_requests as r", "r.id", "b.too_request_id")
    .leftJoinLateral(
      (eb) =>
        eb
          .selectFrom("block_executions as e")
          .innerJoin("users as lu", "lu.id", "e.logged_by")
          .select(["e.outcome", "e.minutes_used", "e.note", "e.logged_at", "lu.name as logged_by_name"])
          .whereRef("e.block_id", "=", "b.id")
          .orderBy("e.logged_at", "desc")
          .orderBy("e.id", "desc")
          .limit(1)
          .as("x"),
      (join) => join.onTrue(),
    )
    .select([
      "b.id",
      "b.kind",
      iso("b.starts_at").as("starts_at"),
      iso("b.ends_at").as("ends_at"),
      "p.code as program_code",
      "p.title as program_title",
      "o.name as observer_name",
      "i.code as instrument_code",
      "i.name as instrument_name",
      "x.outcome",
      "x.minutes_used",
      "x.note as execution_note",
      sql<string | null>`to_char(x.logged_at at time zone 'UTC', 'YYYY-MM-DD"T"HH24:MI:SS.MS"Z"')`.as("logged_at"),
      "x.logged_by_name",
      "r.id as request_id",
      "r.state as request_state",
      "r.target_name",
      "r.target_kind",
      "r.ra_deg",
      "r.dec_deg",
      "r.ra_text",
      "r.dec_text",
      // Only the rows near the night: a long table need not travel on every poll.
      sql<StoredEphemerisRow[] | null>`(
        select jsonb_agg(e order by (e->>'time')::timestamptz) from jsonb_array_elements(r.ephemeris) e
        where (e->>'time')::timestamptz between ${from}::timestamptz - interval '5 days' and ${to}::timestamptz + interval '5 days')`.as("ephemeris"),
      sql<number | null>`jsonb_array_length(r.ephemeris)`.as("ephemeris_rows"),
      "r.justification",
      "r.darkness",
      sql<QueueAttachment[] | null>`(
        select json_agg(json_build_object('id', a.id, 'kind', a.kind, 'fileName', a.file_name, 'sizeBytes', a.size_bytes, 'url', a.url)
          order by (a.kind = 'finding_chart') desc, a.created_at)
        from attachments a where a.request_id = r.id)`.as("attachments"),
    ])
    .where("b.telescope_id", "=", telescopeId)
    .where("b.ends_at", ">", from)
    .where("b.starts_at", "<", to)
    .orderBy("b.starts_at");
}

type BlockJson = Awaited<ReturnType<ReturnType<typeof blocksQuery>["execute"]>>[number];

function toBlockRow(r: BlockJson): QueueBlockRow {
  return {
    id: r.id,
    kind: r.kind,
    startsAt: r.starts_at,
    endsAt: r.ends_at,
    programCode: r.program_code,
    programTitle: r.program_title,
    observerName: r.observer_name,
    instrumentCode: r.instrument_code,
    instrumentName: r.instrument_name,
    execution:
      r.outcome && r.logged_at
        ? { outcome: r.outcome, minutesUsed: r.minutes_used ?? null, note: r.execution_note ?? "", loggedByName: r.logged_by_name ?? "", loggedAt: r.logged_at }
        : null,
    too:
      r.request_id && r.request_state && r.target_kind && r.darkness
        ? {
            requestId: r.request_id,
            state: r.request_state,
            targetName: r.target_name ?? "",
            targetKind: r.target_kind,
            raDeg: r.ra_deg,
            decDeg: r.dec_deg,
            raText: r.ra_text ?? "",
            decText: r.dec_text ?? "",
            ephemeris: r.ephemeris,
            ephemerisRows: r.ephemeris_rows ?? 0,
            justification: r.justification ?? "",
            darkness: r.darkness,
            attachments: r.attachments ?? [],
          }
        : null,
  };
}

function acknowledgementsQuery(db: Db | Trx, telescopeId: string) {
  return db
    .selectFrom("change_acknowledgements as k")
    .innerJoin("users as u", "u.id", "k.user_id")
    .select(["u.name", iso("k.at").as("at"), "k.through_change_id"])
    .where("k.telescope_id", "=", telescopeId)
    .orderBy("k.id", "desc");
}

const toAcknowledgement = (r: { name: string; at: string; through_change_id: number }): QueueAcknowledgement => ({
  userName: r.name,
  at: r.at,
  throughChangeId: Number(r.through_change_id),
});

/** Each person's latest acknowledgement on a telescope and the highest change they acknowledged. */
export interface Acknowledger {
  userId: string;
  last: QueueAcknowledgement;
  highest: number;
}

/**
 * Everything the queue shows besides the sky, for every viewer at once: the night's blocks
 * with their latest log and ToO request, the newest changes that still matter (ending after
 * `changesSince`), the telescope's night assistants and who acknowledged what. One viewer's
 * view of it is lib/tonight/viewer-view.ts.
 */
export interface NightSnapshot {
  blocks: QueueBlockRow[];
  /** Oldest first: all of them when `changesComplete`, otherwise only the newest `changesCap`. */
  changes: QueueChange[];
  changesComplete: boolean;
  assistantIds: string[];
  acknowledgers: Acknowledger[];
  recent: QueueAcknowledgement[];
}

function changesQuery(db: Db | Trx, telescopeId: string, changesSince: Date) {
  return db
    .selectFrom("schedule_changes as c")
    .leftJoin("too_requests as r", "r.id", "c.request_id")
    .select([
      "c.id",
      "c.kind",
      iso("c.at").as("at"),
      iso("c.starts_at").as("starts_at"),
      iso("c.ends_at").as("ends_at"),
      "c.summary",
      "c.block_id",
      "c.request_id",
      "r.target_name",
      sql<number>`count(*) over ()`.as("total"),
    ])
    .where("c.telescope_id", "=", telescopeId)
    .where("c.ends_at", ">", changesSince);
}

type ChangeJson = Awaited<ReturnType<ReturnType<typeof changesQuery>["execute"]>>[number];

const toChange = (c: ChangeJson): QueueChange => ({
  id: Number(c.id),
  kind: c.kind,
  at: c.at,
  startsAt: c.starts_at,
  endsAt: c.ends_at,
  summary: c.summary,
  blockId: c.block_id,
  requestId: c.request_id,
  targetName: c.target_name || null,
});

/** The night's snapshot in one round trip (the route is polled every few seconds by every open page). */
export async function loadNightSnapshot(
  db: Db | Trx,
  q: { telescopeId: string; from: Date; to: Date; changesSince: Date; changesCap: number; acknowledgementsLimit: number },
): Promise<NightSnapshot> {
  const acknowledgers = db
    .selectFrom("change_acknowledgements as k")
    .innerJoin("users as u", "u.id", "k.user_id")
    .distinctOn("k.user_id")
    .select([
      "k.user_id",
      "u.name",
      iso("k.at").as("at"),
      "k.through_change_id",
      sql<number>`max(k.through_change_id) over (partition by k.user_id)`.as("highest"),
    ])
    .where("k.telescope_id", "=", q.telescopeId)
    .orderBy("k.user_id")
    .orderBy("k.id", "desc");

  const row = await db
    .selectNoFrom([
      jsonArrayFrom(blocksQuery(db, q.telescopeId, q.from, q.to)).as("blocks"),
      jsonArrayFrom(changesQuery(db, q.telescopeId, q.changesSince).orderBy("c.id", "desc").limit(q.changesCap)).as("changes"),
      sql<string[]>`coalesce((select array_agg(ta.user_id::text) from telescope_assistants ta where ta.telescope_id = ${q.telescopeId}), '{}')`.as("assistants"),
      jsonArrayFrom(acknowledgers).as("acknowledgers"),
      jsonArrayFrom(acknowledgementsQuery(db, q.telescopeId).limit(q.acknowledgementsLimit)).as("recent"),
    ])
    .executeTakeFirstOrThrow();

  const total = Number(row.changes[0]?.total ?? 0);
  return {
    blocks: row.blocks.map(toBlockRow),
    changes: row.changes.map(toChange).reverse(),
    changesComplete: row.changes.length >= total,
    assistantIds: row.assistants,
    acknowledgers: row.acknowledgers.map((a) => ({ userId: a.user_id, last: toAcknowledgement(a), highest: Number(a.highest) })),
    recent: row.recent.map(toAcknowledgement),
  };
}

/**
 * The changes after a watermark, oldest first, and how many there are: for the rare night
 * with more changes than a snapshot carries.
 */
export async function loadChangesAfter(
  db: Db | Trx,
  q: { telescopeId: string; changesSince: Date; watermark: number; limit: number },
): Promise<{ items: QueueChange[]; total: number }> {
  const rows = await changesQuery(db, q.telescopeId, q.changesSince)
    .where(sql<boolean>`c.id > ${q.watermark}`)
    .orderBy("c.id")
    .limit(q.limit)
    .execute();
  return { items: rows.map(toChange), total: Number(rows[0]?.total ?? 0) };
}

export async function findLastAcknowledgement(db: Db | Trx, telescopeId: string, userId: string): Promise<QueueAcknowledgement | undefined> {
  const row = await acknowledgementsQuery(db, telescopeId).where("k.user_id", "=", userId).limit(1).executeTakeFirst();
  return row && toAcknowledgement(row);
}

export async function findLatestChangeId(db: Db | Trx, telescopeId: string): Promise<number | null> {
  const row = await db.selectFrom("schedule_changes").select((eb) => eb.fn.max("id").as("id")).where("telescope_id", "=", telescopeId).executeTakeFirst();
  return row?.id == null ? null : Number(row.id);
}

export async function insertAcknowledgement(trx: Trx, values: { telescopeId: string; userId: string; throughChangeId: number }): Promise<Date> {
  const row = await trx
    .insertInto("change_acknowledgements")
    .values({ telescope_id: values.telescopeId, user_id: values.userId, through_change_id: values.throughChangeId })
    .returning("at")
    .executeTakeFirstOrThrow();
  return row.at;
}

export interface LockedBlock {
  id: string;
  telescopeId: string;
  kind: BlockKind;
  startsAt: Date;
  endsAt: Date;
  tooRequestId: string | null;
}

/** Locks the block for the rest of the transaction, so two logs of one block go one after the other. */
export async function lockBlockForLog(trx: Trx, blockId: string): Promise<LockedBlock | undefined> {
  const r = await trx
    .selectFrom("blocks")
    .select(["id", "telescope_id", "kind", "starts_at", "ends_at", "too_request_id"])
    .where("id", "=", blockId)
    .forUpdate()
    .executeTakeFirst();
  return r && { id: r.id, telescopeId: r.telescope_id, kind: r.kind, startsAt: r.starts_at, endsAt: r.ends_at, tooRequestId: r.too_request_id };
}

export async function insertBlockExecution(
  trx: Trx,
  values: { blockId: string; outcome: ExecutionOutcome; minutesUsed: number | null; note: string; loggedBy: string },
): Promise<{ id: string; loggedAt: Date }> {
  const row = await trx
    .insertInto("block_executions")
    .values({ block_id: values.blockId, outcome: values.outcome, minutes_used: values.minutesUsed, note: values.note, logged_by: values.loggedBy })
    .returning(["id", "logged_at"])
    .executeTakeFirstOrThrow();
  return { id: row.id, loggedAt: row.logged_at };
}

/** The names an outcome notice carries: the request's target and program, the block's telescope and site, the person logging. */
export async function loadOutcomeNoticeFacts(trx: Trx, values: { requestId: string; blockId: string; actorId: string }) {
  const row = await trx
    .selectFrom("blocks as b")
    .innerJoin("telescopes as t", "t.id", "b.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .innerJoin("too_requests as r", (join) => join.on("r.id", "=", values.requestId))
    .leftJoin("programs as rp", "rp.id", "r.program_id")
    .leftJoin("programs as bp", "bp.id", "b.program_id")
    .select([
      "r.target_name",
      "rp.code as request_program_code",
      "bp.code as block_program_code",
      "t.code as telescope_code",
      "t.name as telescope_name",
      "s.code as site_code",
      "s.name as site_name",
      "s.time_zone",
    ])
    .where("b.id", "=", values.blockId)
    .executeTakeFirst();
  const actor = await trx.selectFrom("users").select(["name", "email"]).where("id", "=", values.actorId).executeTakeFirst();
  if (!row || !actor) return undefined;
  return {
    targetName: row.target_name,
    programCode: row.request_program_code ?? row.block_program_code ?? "ToO",
    telescope: { code: row.telescope_code, name: row.telescope_name },
    site: { code: row.site_code, name: row.site_name, timeZone: row.time_zone },
    loggedBy: { name: actor.name, email: actor.email },
  };
}
