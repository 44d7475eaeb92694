import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import type { TelescopeInput } from "./schemas";

export interface TelescopeSummary {
  id: string;
  code: string;
  name: string;
  siteName: string;
  timeZone: string;
}

export async function listTelescopesForAssistant(db: Db, userId: string): Promise<TelescopeSummary[]> {
  const rows = await db
    .selectFrom("telescope_assistants as ta")
    .innerJoin("telescopes as t", "t.id", "ta.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "s.name as site_name", "s.time_zone"])
    .where("ta.user_id", "=", userId)
    .orderBy("t.code")
    .execute();
  return rows.map((r) => ({ id: r.id, code: r.code, name: r.name, siteName: r.site_name, timeZone: r.time_zone }));
}

export interface PersonRef {
  id: string;
  name: string;
}

/** A telescope as the admin pages see it. */
export interface Telescope {
  id: string;
  siteId: string;
  siteCode: string;
  code: string;
  name: string;
  apertureM: number;
  minAltitudeDeg: number;
  maxAirmass: number;
  sunAvoidanceDeg: number;
  hourAngleMinH: number;
  hourAngleMaxH: number;
  setupMinutes: number;
  assistants: PersonRef[];
  instrumentCount: number;
  blockCount: number;
}

export interface TelescopeOption {
  id: string;
  code: string;
  name: string;
  siteCode: string;
}

function telescopesQuery(db: Db | Trx) {
  return db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select((eb) => [
      "t.id",
      "t.site_id",
      "s.code as site_code",
      "t.code",
      "t.name",
      "t.aperture_m",
      "t.min_altitude_deg",
      "t.max_airmass",
      "t.sun_avoidance_deg",
      "t.hour_angle_min_h",
      "t.hour_angle_max_h",
      "t.setup_minutes",
      sql<PersonRef[]>`coalesce((
        select json_agg(json_build_object('id', u.id, 'name', u.name) order by u.name)
        from telescope_assistants ta join users u on u.id = ta.user_id
        where ta.telescope_id = t.id), '[]'::json)`.as("assistants"),
      eb.selectFrom("instruments as i").select(eb.fn.countAll<number>().as("n")).whereRef("i.telescope_id", "=", "t.id").as("instrument_count"),
      eb.selectFrom("blocks as b").select(eb.fn.countAll<number>().as("n")).whereRef("b.telescope_id", "=", "t.id").as("block_count"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof telescopesQuery>["execute"]>>[number];

function toTelescope(r: Row): Telescope {
  return {
    id: r.id,
    siteId: r.site_id,
    siteCode: r.site_code,
    code: r.code,
    name: r.name,
    apertureM: r.aperture_m,
    minAltitudeDeg: r.min_altitude_deg,
    maxAirmass: r.max_airmass,
    sunAvoidanceDeg: r.sun_avoidance_deg,
    hourAngleMinH: r.hour_angle_min_h,
    hourAngleMaxH: r.hour_angle_max_h,
    setupMinutes: r.setup_minutes,
    assistants: r.assistants,
    instrumentCount: Number(r.instrument_count ?? 0),
    blockCount: Number(r.block_count ?? 0),
  };
}

export async function listTelescopes(db: Db): Promise<Telescope[]> {
  return (await telescopesQuery(db).orderBy("t.code").execute()).map(toTelescope);
}

export async function findTelescopeById(db: Db | Trx, id: string): Promise<Telescope | undefined> {
  const row = await telescopesQuery(db).where("t.id", "=", id).executeTakeFirst();
  return row && toTelescope(row);
}

export async function listTelescopeOptions(db: Db): Promise<TelescopeOption[]> {
  const rows = await db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "s.code as site_code"])
    .orderBy("t.code")
    .execute();
  return rows.map((r) => ({ id: r.id, code: r.code, name: r.name, siteCode: r.site_code }));
}

export async function findTelescopeIdByCode(trx: Db | Trx, code: string): Promise<string | undefined> {
  return (await trx.selectFrom("telescopes").select("id").where("code", "=", code).executeTakeFirst())?.id;
}

/** Locks the telescope row for the rest of the transaction; undefined when it is gone. */
export async function lockTelescope(trx: Trx, id: string): Promise<Telescope | undefined> {
  const locked = await trx.selectFrom("telescopes").select("id").where("id", "=", id).forUpdate().executeTakeFirst();
  return locked && findTelescopeById(trx, id);
}

function columns(input: TelescopeInput) {
  return {
    site_id: input.siteId,
    code: input.code,
    name: input.name,
    aperture_m: input.apertureM,
    min_altitude_deg: input.minAltitudeDeg,
    max_airmass: input.maxAirmass,
    sun_avoidance_deg: input.sunAvoidanceDeg,
    hour_angle_min_h: input.hourAngleMinH,
    hour_angle_max_h: input.hourAngleMaxH,
    setup_minutes: input.setupMinutes,
  };
}

export async function insertTelescope(trx: Trx, input: TelescopeInput): Promise<string> {
  return (await trx.insertInto("telescopes").values(columns(input)).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updateTelescopeById(trx: Trx, id: string, input: TelescopeInput): Promise<void> {
  await trx.updateTable("telescopes").set(columns(input)).where("id", "=", id).execute();
}

export async function replaceTelescopeAssistants(trx: Trx, telescopeId: string, userIds: readonly string[]): Promise<void> {
  await trx.deleteFrom("telescope_assistants").where("telescope_id", "=", telescopeId).execute();
  if (userIds.length) {
    await trx.insertInto("telescope_assistants").values(userIds.map((user_id) => ({ telescope_id: telescopeId, user_id }))).execute();
  }
}

export async function deleteTelescopeById(trx: Trx, id: string): Promise<void> {
  await trx.deleteFrom("telescopes").where("id", "=", id).execute();
}
