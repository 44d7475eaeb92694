/**
 * Small, self-contained fixtures for integration tests: every call makes its own site,
 * telescope and program with unique codes, so tests never step on each other's rows.
 */
import { createHash, randomUUID } from "node:crypto";
import { getDb } from "@/db/index";
import type { Role } from "@/db/types";
import { hashToken } from "@/lib/api-tokens/queries";
import { hashPassword } from "@/lib/auth/password";

const unique = () => randomUUID().slice(0, 8);

let cachedHash: string | undefined;
export const FIXTURE_PASSWORD = "correct horse battery";

export async function makeUser(roles: Role[], opts: { disabled?: boolean } = {}) {
  const db = getDb();
  cachedHash ??= await hashPassword(FIXTURE_PASSWORD);
  const email = `u-${unique()}@fixture.test`;
  const { id } = await db
    .insertInto("users")
    .values({ email, name: `Fixture ${email}`, password_hash: cachedHash, disabled_at: opts.disabled ? new Date() : null })
    .returning("id")
    .executeTakeFirstOrThrow();
  if (roles.length) await db.insertInto("user_roles").values(roles.map((role) => ({ user_id: id, role }))).execute();
  return { id, email };
}

export async function makeToken(userId: string, opts: { revoked?: boolean } = {}) {
  const token = `nbk_${randomUUID().replace(/-/g, "")}`;
  await getDb()
    .insertInto("api_tokens")
    .values({ user_id: userId, name: "fixture", token_prefix: token.slice(0, 8), token_hash: hashToken(token), revoked_at: opts.revoked ? new Date() : null })
    .execute();
  return token;
}

const FIXTURE_SEMESTERS_FROM = Date.UTC(3000, 0, 1);

/**
 * Dates for a fixture semester. Semesters may not overlap (semesters_no_overlap) and the
 * suite shares one database, so each fixture semester is one minute of its own after
 * 3000-01-01, chosen by 32 bits of a hash of its code: two collide about as often as two
 * random 8-hex codes do, and nothing reads a fixture semester's dates. Tests about
 * semester dates give their own, before 3000.
 */
export function fixtureSemesterDates(code: string): { startsAt: Date; endsAt: Date } {
  const slot = createHash("sha256").update(code).digest().readUInt32BE(0);
  const startsAt = new Date(FIXTURE_SEMESTERS_FROM + slot * 60_000);
  return { startsAt, endsAt: new Date(startsAt.getTime() + 60_000) };
}

/** A semester of its own (see fixtureSemesterDates) with the given code. */
export async function makeSemester(code: string): Promise<{ id: string }> {
  const { startsAt, endsAt } = fixtureSemesterDates(code);
  return getDb().insertInto("semesters").values({ code, starts_at: startsAt, ends_at: endsAt }).returning("id").executeTakeFirstOrThrow();
}

/** A partner, a semester of its own and a science program (code `PRG<code>`) led by `piId`. */
export async function makeProgram(code: string, piId: string, opts: { tooAllowed?: boolean } = {}): Promise<{ id: string }> {
  const db = getDb();
  const partner = await db.insertInto("partners").values({ code: `P${code}`, name: `Partner ${code}` }).returning("id").executeTakeFirstOrThrow();
  const semester = await makeSemester(`SEM${code}`);
  return db
    .insertInto("programs")
    .values({ code: `PRG${code}`, title: "Fixture program", semester_id: semester.id, partner_id: partner.id, pi_user_id: piId, rank: 2, allocated_hours: 10, category: "science", ...(opts.tooAllowed ? { too_allowed: true } : {}) })
    .returning("id")
    .executeTakeFirstOrThrow();
}

export async function makeTelescopeAndProgram() {
  const db = getDb();
  const code = unique();
  const pi = await makeUser(["pi"]);
  const site = await db
    .insertInto("sites")
    .values({ code: `S${code}`, name: `Site ${code}`, latitude_deg: -30, longitude_deg: -70, height_m: 2000, time_zone: "America/Santiago" })
    .returning("id")
    .executeTakeFirstOrThrow();
  const telescope = await db
    .insertInto("telescopes")
    .values({ site_id: site.id, code: `T${code}`, name: `Scope ${code}`, aperture_m: 2, min_altitude_deg: 20, max_airmass: 2.5, sun_avoidance_deg: 40, hour_angle_min_h: -6, hour_angle_max_h: 6 })
    .returning("id")
    .executeTakeFirstOrThrow();
  const program = await makeProgram(code, pi.id);
  return { siteId: site.id, telescopeId: telescope.id, programId: program.id, piId: pi.id };
}
