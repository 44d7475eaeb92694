/**
 * Reads and writes for ToO requests (Kysely only). Rows become the app's own types here:
 * snake_case never leaves this file. Functions taking `trx: Trx` expect to run inside the
 * caller's transaction.
 */
import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import type { RequestState } from "@/db/types";
import type { RequestFields } from "./fields-map";
import type { FeasibilitySnapshot } from "./feasibility/types";
import type { RequestEvent, RequestListItem, TooRequest } from "./types";

function requestsQuery(db: Db | Trx) {
  return db
    .selectFrom("too_requests as r")
    .innerJoin("users as u", "u.id", "r.pi_user_id")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .leftJoin("instruments as i", "i.id", "r.instrument_id")
    .selectAll("r")
    .select([
      "u.name as pi_name",
      "p.code as program_code",
      "p.title as program_title",
      "i.code as instrument_code",
      sql<{ id: string; code: string; name: string }[]>`coalesce((
        select json_agg(json_build_object('id', t.id, 'code', t.code, 'name', t.name) order by t.code)
        from too_request_telescopes rt join telescopes t on t.id = rt.telescope_id
        where rt.request_id = r.id), '[]'::json)`.as("telescopes"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof requestsQuery>["execute"]>>[number];

function toRequest(r: Row): TooRequest {
  return {
    id: r.id,
    piUserId: r.pi_user_id,
    piName: r.pi_name,
    programId: r.program_id,
    programCode: r.program_code,
    programTitle: r.program_title,
    source: r.source,
    state: r.state,
    targetName: r.target_name,
    target: {
      kind: r.target_kind,
      raText: r.ra_text,
      decText: r.dec_text,
      raDeg: r.ra_deg,
      decDeg: r.dec_deg,
      ephemeris: r.ephemeris,
      hMag: r.h_mag,
      gSlope: r.g_slope,
    },
    telescopes: r.telescopes,
    instrumentId: r.instrument_id,
    instrumentCode: r.instrument_code,
    durationMinutes: r.duration_minutes,
    earliestStart: r.earliest_start,
    latestEnd: r.latest_end,
    deadline: r.deadline,
    urgency: r.urgency,
    constraints: {
      maxAirmass: r.max_airmass,
      darkness: r.darkness,
      minMoonSeparationDeg: r.min_moon_sep_deg,
      maxMoonIllumination: r.max_moon_illum,
    },
    justification: r.justification,
    feasibility: (r.feasibility ?? null) as FeasibilitySnapshot | null,
    directorNote: r.director_note,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
    submittedAt: r.submitted_at,
  };
}

export async function findRequestById(db: Db | Trx, id: string): Promise<TooRequest | undefined> {
  const row = await requestsQuery(db).where("r.id", "=", id).executeTakeFirst();
  return row && toRequest(row);
}

/** Locks the request row for the rest of the transaction (state changes go one at a time). */
export async function lockRequest(trx: Trx, id: string): Promise<{ id: string; piUserId: string; state: RequestState } | undefined> {
  const row = await trx.selectFrom("too_requests").select(["id", "pi_user_id", "state"]).where("id", "=", id).forUpdate().executeTakeFirst();
  return row && { id: row.id, piUserId: row.pi_user_id, state: row.state };
}

export async function listRequestsForPi(db: Db, piUserId: string): Promise<RequestListItem[]> {
  const rows = await db
    .selectFrom("too_requests as r")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .select([
      "r.id",
      "r.state",
      "r.target_name",
      "p.code as program_code",
      "r.urgency",
      "r.deadline",
      "r.created_at",
      "r.updated_at",
      "r.submitted_at",
      sql<string[]>`coalesce((
        select array_agg(t.code order by t.code)
        from too_request_telescopes rt join telescopes t on t.id = rt.telescope_id
        where rt.request_id = r.id), '{}')`.as("telescope_codes"),
    ])
    .where("r.pi_user_id", "=", piUserId)
    .orderBy("r.updated_at", "desc")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    state: r.state,
    targetName: r.target_name,
    programCode: r.program_code,
    urgency: r.urgency,
    telescopeCodes: r.telescope_codes,
    deadline: r.deadline,
    createdAt: r.created_at,
    updatedAt: r.updated_at,
    submittedAt: r.submitted_at,
  }));
}

function columns(f: RequestFields) {
  return {
    program_id: f.programId,
    target_name: f.targetName,
    target_kind: f.targetKind,
    ra_text: f.raText,
    dec_text: f.decText,
    ra_deg: f.raDeg,
    dec_deg: f.decDeg,
    ephemeris: f.ephemeris === null ? null : JSON.stringify(f.ephemeris),
    h_mag: f.hMag,
    g_slope: f.gSlope,
    instrument_id: f.instrumentId,
    duration_minutes: f.durationMinutes,
    earliest_start: f.earliestStart,
    latest_end: f.latestEnd,
    deadline: f.deadline,
    urgency: f.urgency,
    max_airmass: f.maxAirmass,
    darkness: f.darkness,
    min_moon_sep_deg: f.minMoonSeparationDeg,
    max_moon_illum: f.maxMoonIllumination,
    justification: f.justification,
  };
}

export async function insertRequest(trx: Trx, piUserId: string, source: "form" | "api", fields: RequestFields): Promise<string> {
  const { id } = await trx
    .insertInto("too_requests")
    .values({ pi_user_id: piUserId, source, ...columns(fields) })
    .returning("id")
    .executeTakeFirstOrThrow();
  await replaceRequestTelescopes(trx, id, fields.telescopeIds);
  return id;
}

export async function updateRequestFields(trx: Trx, id: string, fields: RequestFields): Promise<void> {
  await trx
    .updateTable("too_requests")
    .set({ ...columns(fields), updated_at: new Date() })
    .where("id", "=", id)
    .execute();
  await replaceRequestTelescopes(trx, id, fields.telescopeIds);
}

async function replaceRequestTelescopes(trx: Trx, requestId: string, telescopeIds: readonly string[]): Promise<void> {
  await trx.deleteFrom("too_request_telescopes").where("request_id", "=", requestId).execute();
  if (telescopeIds.length > 0) {
    await trx
      .insertInto("too_request_telescopes")
      .values(telescopeIds.map((telescope_id) => ({ request_id: requestId, telescope_id })))
      .execute();
  }
}

export async function setRequestState(
  trx: Trx,
  id: string,
  state: RequestState,
  extra: { submittedAt?: Date; feasibility?: FeasibilitySnapshot } = {},
): Promise<void> {
  await trx
    .updateTable("too_requests")
    .set({
      state,
      updated_at: new Date(),
      ...(extra.submittedAt ? { submitted_at: extra.submittedAt } : {}),
      ...(extra.feasibility ? { feasibility: JSON.stringify(extra.feasibility) } : {}),
    })
    .where("id", "=", id)
    .execute();
}

export async function insertRequestEvent(
  trx: Trx,
  event: { requestId: string; actorUserId: string | null; from: RequestState | null; to: RequestState; note?: string },
): Promise<void> {
  await trx
    .insertInto("request_events")
    .values({ request_id: event.requestId, actor_user_id: event.actorUserId, from_state: event.from, to_state: event.to, note: event.note ?? "" })
    .execute();
}

export async function listRequestEvents(db: Db | Trx, requestId: string): Promise<RequestEvent[]> {
  const rows = await db
    .selectFrom("request_events as e")
    .leftJoin("users as u", "u.id", "e.actor_user_id")
    .select(["e.id", "e.at", "u.name as actor_name", "e.from_state", "e.to_state", "e.note"])
    .where("e.request_id", "=", requestId)
    .orderBy("e.at")
    .orderBy("e.id")
    .execute();
  return rows.map((r) => ({ id: String(r.id), at: r.at, actorName: r.actor_name, fromState: r.from_state, toState: r.to_state, note: r.note }));
}
