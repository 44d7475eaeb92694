/** What a request refers to — ToO programs, telescopes with their sites, instruments — read for the form and the checks. */
import type { Db, Trx } from "@/db/index";
import type { InstrumentRef, TelescopeSky } from "./feasibility/types";

export interface ProgramOption {
  id: string;
  code: string;
  title: string;
}

/** The PI's programs that may spend ToO time. */
export async function listTooProgramsForPi(db: Db, piUserId: string): Promise<ProgramOption[]> {
  return db
    .selectFrom("programs")
    .select(["id", "code", "title"])
    .where("pi_user_id", "=", piUserId)
    .where("too_allowed", "=", true)
    .orderBy("code")
    .execute();
}

export async function findProgramForFiling(db: Db | Trx, id: string): Promise<{ code: string; piUserId: string; tooAllowed: boolean } | undefined> {
  const row = await db.selectFrom("programs").select(["code", "pi_user_id", "too_allowed"]).where("id", "=", id).executeTakeFirst();
  return row && { code: row.code, piUserId: row.pi_user_id, tooAllowed: row.too_allowed };
}

function telescopesQuery(db: Db | Trx) {
  return db
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select([
      "t.id",
      "t.code",
      "t.name",
      "t.min_altitude_deg",
      "t.max_airmass",
      "t.sun_avoidance_deg",
      "t.hour_angle_min_h",
      "t.hour_angle_max_h",
      "s.id as site_id",
      "s.code as site_code",
      "s.name as site_name",
      "s.latitude_deg",
      "s.longitude_deg",
      "s.height_m",
      "s.time_zone",
    ])
    .orderBy("t.code");
}

/** Telescopes with the limits and site the sky engine needs; all of them when `ids` is absent. */
export async function listTelescopesForSky(db: Db | Trx, ids?: readonly string[]): Promise<TelescopeSky[]> {
  if (ids && ids.length === 0) return [];
  const rows = await (ids ? telescopesQuery(db).where("t.id", "in", ids) : telescopesQuery(db)).execute();
  return rows.map((r) => ({
    id: r.id,
    code: r.code,
    name: r.name,
    minAltitudeDeg: r.min_altitude_deg,
    maxAirmass: r.max_airmass,
    sunAvoidanceDeg: r.sun_avoidance_deg,
    hourAngleMinH: r.hour_angle_min_h,
    hourAngleMaxH: r.hour_angle_max_h,
    site: { id: r.site_id, code: r.site_code, name: r.site_name, latitudeDeg: r.latitude_deg, longitudeDeg: r.longitude_deg, heightM: r.height_m, timeZone: r.time_zone },
  }));
}

function instrumentsQuery(db: Db | Trx) {
  return db
    .selectFrom("instruments as i")
    .innerJoin("telescopes as t", "t.id", "i.telescope_id")
    .select(["i.id", "i.telescope_id", "t.code as telescope_code", "i.code", "i.name", "i.limiting_magnitude"])
    .orderBy("t.code")
    .orderBy("i.code");
}

export interface InstrumentOption extends InstrumentRef {
  telescopeCode: string;
}

function toInstrument(r: { id: string; telescope_id: string; telescope_code: string; code: string; name: string; limiting_magnitude: number }): InstrumentOption {
  return { id: r.id, telescopeId: r.telescope_id, telescopeCode: r.telescope_code, code: r.code, name: r.name, limitingMagnitude: r.limiting_magnitude };
}

export async function listInstrumentOptions(db: Db): Promise<InstrumentOption[]> {
  return (await instrumentsQuery(db).execute()).map(toInstrument);
}

export async function findInstrumentOption(db: Db | Trx, id: string): Promise<InstrumentOption | undefined> {
  const row = await instrumentsQuery(db).where("i.id", "=", id).executeTakeFirst();
  return row && toInstrument(row);
}
