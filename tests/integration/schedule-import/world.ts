/**
 * A small consortium of its own for each test: a site in the given zone, a telescope with
 * an instrument, two programs and an observer, all with unique codes.
 */
import { randomUUID } from "node:crypto";
import { getDb } from "@/db/index";
import { makeSemester, makeUser } from "../fixtures";

export async function makeImportWorld(timeZone = "America/Santiago") {
  const db = getDb();
  const u = randomUUID().slice(0, 8);
  const pi = await makeUser(["pi"]);
  const observer = await makeUser(["observer"]);
  const site = await db
    .insertInto("sites")
    .values({ code: `IS${u}`, name: `Import site ${u}`, latitude_deg: 40, longitude_deg: -4, height_m: 1000, time_zone: timeZone })
    .returning("id")
    .executeTakeFirstOrThrow();
  const telescope = await db
    .insertInto("telescopes")
    .values({ site_id: site.id, code: `IT${u}`, name: `Import scope ${u}`, aperture_m: 1.8, min_altitude_deg: 20, max_airmass: 2.5, sun_avoidance_deg: 40, hour_angle_min_h: -6, hour_angle_max_h: 6 })
    .returning(["id", "code"])
    .executeTakeFirstOrThrow();
  const instrument = await db
    .insertInto("instruments")
    .values({ telescope_id: telescope.id, code: `CAM${u}`, name: "Imager", limiting_magnitude: 21 })
    .returning(["id", "code"])
    .executeTakeFirstOrThrow();
  const partner = await db.insertInto("partners").values({ code: `IP${u}`, name: `Partner ${u}` }).returning("id").executeTakeFirstOrThrow();
  const semester = await makeSemester(`ISEM${u}`);
  const program = (code: string, category: "science" | "engineering") =>
    db
      .insertInto("programs")
      .values({ code, title: `Program ${code}`, semester_id: semester.id, partner_id: partner.id, pi_user_id: pi.id, rank: 2, allocated_hours: 40, category })
      .returning(["id", "code"])
      .executeTakeFirstOrThrow();
  const science = await program(`SCI${u}`, "science");
  const engineering = await program(`ENG${u}`, "engineering");
  return { telescope, instrument, science, engineering, observer, pi, timeZone };
}

export type ImportWorld = Awaited<ReturnType<typeof makeImportWorld>>;

export async function blocksOn(telescopeId: string) {
  return getDb().selectFrom("blocks").selectAll().where("telescope_id", "=", telescopeId).orderBy("starts_at").execute();
}

export async function importAudits(actorId: string) {
  return getDb().selectFrom("audit_log").selectAll().where("actor_user_id", "=", actorId).where("action", "=", "schedule.import").execute();
}
