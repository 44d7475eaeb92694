/**
 * A PI with a ToO program, a southern site (latitude −30°) with one telescope and one
 * instrument, and request bodies aimed at targets whose observability does not depend
 * on the date the tests run: a field opposite the Sun (up all night), the Sun's own
 * place (inside every sun-avoidance limit), and a far-northern field that never rises.
 */
import { randomUUID } from "node:crypto";
import { getDb } from "@/db/index";
import type { RequestFormValues } from "@/lib/requests/schemas";
import { formatDec, formatRa, sunPosition } from "@/lib/sky";
import { makeSemester, makeToken, makeUser } from "../fixtures";

const unique = () => randomUUID().slice(0, 8);
const HOUR = 3_600_000;

export interface RequestWorld {
  piId: string;
  piToken: string;
  programId: string;
  telescopeId: string;
  telescopeCode: string;
  instrumentId: string;
}

export async function makeRequestWorld(opts: { tooAllowed?: boolean } = {}): Promise<RequestWorld> {
  const db = getDb();
  const code = unique();
  const pi = await makeUser(["pi"]);
  const site = await db
    .insertInto("sites")
    .values({ code: `RS${code}`, name: `Request site ${code}`, latitude_deg: -30, longitude_deg: -70, height_m: 2000, time_zone: "America/Santiago" })
    .returning("id")
    .executeTakeFirstOrThrow();
  const telescope = await db
    .insertInto("telescopes")
    .values({ site_id: site.id, code: `RT${code}`, name: `Scope ${code}`, aperture_m: 2, min_altitude_deg: 20, max_airmass: 2.9, sun_avoidance_deg: 40, hour_angle_min_h: -6, hour_angle_max_h: 6 })
    .returning("id")
    .executeTakeFirstOrThrow();
  const instrument = await db
    .insertInto("instruments")
    .values({ telescope_id: telescope.id, code: "CAM", name: "Camera", limiting_magnitude: 21 })
    .returning("id")
    .executeTakeFirstOrThrow();
  const partner = await db.insertInto("partners").values({ code: `RP${code}`, name: `Partner ${code}` }).returning("id").executeTakeFirstOrThrow();
  const semester = await makeSemester(`RSEM${code}`);
  const program = await db
    .insertInto("programs")
    .values({
      code: `RTOO${code}`,
      title: "Fixture ToO program",
      semester_id: semester.id,
      partner_id: partner.id,
      pi_user_id: pi.id,
      rank: 1,
      allocated_hours: 10,
      category: "science",
      too_allowed: opts.tooAllowed ?? true,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return { piId: pi.id, piToken: await makeToken(pi.id), programId: program.id, telescopeId: telescope.id, telescopeCode: `RT${code}`, instrumentId: instrument.id };
}

/** Opposite the Sun at `now`, at the site's zenith declination: observable every night. */
export function antiSolar(now: Date): { ra: string; dec: string } {
  const sun = sunPosition(now.getTime());
  return { ra: formatRa((sun.raDeg + 180) % 360, { decimals: 1 }), dec: "-30 00 00" };
}

/** The Sun's own place at `now`: every night refused for sun avoidance. */
export function atTheSun(now: Date): { ra: string; dec: string } {
  const sun = sunPosition(now.getTime());
  return { ra: formatRa(sun.raDeg), dec: formatDec(sun.decDeg) };
}

/** Declination +80° never rises at latitude −30°, and stays far from the Sun. */
export const NEVER_RISES = { ra: "06:00:00", dec: "+80:00:00" };

export function requestBody(world: RequestWorld, now: Date, target: { ra: string; dec: string }, overrides: Partial<RequestFormValues> = {}): RequestFormValues {
  const iso = (ms: number) => new Date(ms).toISOString();
  return {
    programId: world.programId,
    targetName: "Fixture transient",
    target: { kind: "fixed", ra: target.ra, dec: target.dec },
    telescopeIds: [world.telescopeId],
    instrumentId: world.instrumentId,
    durationMinutes: 60,
    earliestStart: iso(now.getTime()),
    latestEnd: iso(now.getTime() + 72 * HOUR),
    deadline: iso(now.getTime() + 72 * HOUR),
    urgency: "within_days",
    constraints: { darkness: "nautical", maxAirmass: 2.5 },
    justification: "A fast-fading transient needs photometry before it fades below reach.",
    ...overrides,
  };
}
