/** A telescope with a night of contiguous blocks and a submitted ToO request for it. */
import { getDb } from "@/db/index";
import { findUserById } from "@/lib/users/queries";
import { makeTelescopeAndProgram, makeUser } from "../fixtures";

export const at = (iso: string) => new Date(iso);

export async function makeWorld(blocks: Array<[string, string, string?]>) {
  const db = getDb();
  const base = await makeTelescopeAndProgram();
  const observer = await makeUser(["observer"]);
  const director = await makeUser(["director"]);
  const program = await db.selectFrom("programs").selectAll().where("id", "=", base.programId).executeTakeFirstOrThrow();
  const tooProgram = await db
    .insertInto("programs")
    .values({ code: `${program.code}-TOO`, title: "Fixture ToO", semester_id: program.semester_id, partner_id: program.partner_id, pi_user_id: base.piId, rank: 1, allocated_hours: 10, category: "science", too_allowed: true })
    .returning("id")
    .executeTakeFirstOrThrow();
  const instrument = await db.insertInto("instruments").values({ telescope_id: base.telescopeId, code: "CAM", name: "Camera", limiting_magnitude: 22 }).returning("id").executeTakeFirstOrThrow();
  const blockIds: string[] = [];
  for (const [start, end, kind] of blocks) {
    const row = await db
      .insertInto("blocks")
      .values({ telescope_id: base.telescopeId, program_id: base.programId, observer_user_id: observer.id, kind: (kind as "science") ?? "science", starts_at: at(start), ends_at: at(end) })
      .returning("id")
      .executeTakeFirstOrThrow();
    blockIds.push(row.id);
  }
  const directorUser = await findUserById(db, director.id);
  if (!directorUser) throw new Error("fixture director missing");
  return { ...base, observer, director: directorUser, tooProgramId: tooProgram.id, instrumentId: instrument.id, blockIds };
}

export async function makeSubmittedRequest(
  world: Awaited<ReturnType<typeof makeWorld>>,
  targetName = "Fixture comet",
  window: { earliestStart?: Date; deadline?: Date; state?: "submitted" | "in_review" } = {},
) {
  const db = getDb();
  const request = await db
    .insertInto("too_requests")
    .values({
      pi_user_id: world.piId,
      program_id: world.tooProgramId,
      target_name: targetName,
      target_kind: "fixed",
      ra_deg: 10,
      dec_deg: -20,
      instrument_id: world.instrumentId,
      duration_minutes: 60,
      earliest_start: window.earliestStart ?? at("2027-01-01T00:00:00Z"),
      latest_end: at("2027-06-01T00:00:00Z"),
      // Far off by default, so approving never meets the passed-deadline refusal whatever day the suite runs.
      deadline: window.deadline ?? at("2099-01-01T00:00:00Z"),
      urgency: "within_days",
      state: window.state ?? "submitted",
      submitted_at: new Date(),
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db.insertInto("too_request_telescopes").values({ request_id: request.id, telescope_id: world.telescopeId }).execute();
  return request.id;
}
