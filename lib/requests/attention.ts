/**
 * What needs a PI's attention, for their home page: requests the director returned for
 * changes, drafts not yet filed, and their approved overrides that have not ended yet.
 * A returned request is a draft with a return decision on it (approval and decline are
 * final, so a draft can have no other decision).
 */
import type { Db } from "@/db/index";

export interface ReturnedRequest {
  id: string;
  targetName: string;
  programCode: string | null;
  /** What the director asked the PI to change. */
  note: string;
  returnedBy: string;
  returnedAt: Date;
  /** The first acceptable telescope's site zone, for local time beside UT. */
  timeZone: string;
}

export interface DraftRequest {
  id: string;
  targetName: string;
  programCode: string | null;
  updatedAt: Date;
}

export interface UpcomingOverride {
  requestId: string;
  targetName: string;
  programCode: string;
  telescope: { code: string; name: string };
  site: { name: string; timeZone: string };
  startsAt: Date;
  endsAt: Date;
}

export interface PiAttention {
  /** Most recently returned first. */
  returned: ReturnedRequest[];
  /** Most recently edited first. */
  drafts: DraftRequest[];
  /** Soonest first; one under way now is included until it ends. */
  overrides: UpcomingOverride[];
}

export async function listPiAttention(db: Db, piUserId: string, now: Date): Promise<PiAttention> {
  const [drafts, overrides] = await Promise.all([listDraftsWithReturns(db, piUserId), listUpcomingOverrides(db, piUserId, now)]);
  return {
    returned: drafts.flatMap((d) =>
      d.returned_at && d.returned_by !== null && d.note !== null
        ? [{ id: d.id, targetName: d.target_name, programCode: d.program_code, note: d.note, returnedBy: d.returned_by, returnedAt: d.returned_at, timeZone: d.time_zone ?? "UTC" }]
        : [],
    ),
    drafts: drafts.filter((d) => !d.returned_at).map((d) => ({ id: d.id, targetName: d.target_name, programCode: d.program_code, updatedAt: d.updated_at })),
    overrides,
  };
}

function listDraftsWithReturns(db: Db, piUserId: string) {
  return db
    .selectFrom("too_requests as r")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .leftJoinLateral(
      (eb) =>
        eb
          .selectFrom("request_decisions as d")
          .innerJoin("users as u", "u.id", "d.decided_by")
          .select(["d.note", "d.decided_at", "u.name"])
          .whereRef("d.request_id", "=", "r.id")
          .where("d.decision", "=", "return")
          .orderBy("d.decided_at", "desc")
          .limit(1)
          .as("ret"),
      (join) => join.onTrue(),
    )
    .select((eb) => [
      "r.id",
      "r.target_name",
      "r.updated_at",
      "p.code as program_code",
      "ret.note",
      "ret.decided_at as returned_at",
      "ret.name as returned_by",
      eb
        .selectFrom("too_request_telescopes as rt")
        .innerJoin("telescopes as t", "t.id", "rt.telescope_id")
        .innerJoin("sites as s", "s.id", "t.site_id")
        .select("s.time_zone")
        .whereRef("rt.request_id", "=", "r.id")
        .orderBy("t.code")
        .limit(1)
        .as("time_zone"),
    ])
    .where("r.pi_user_id", "=", piUserId)
    .where("r.state", "=", "draft")
    .orderBy((eb) => eb.fn.coalesce("ret.decided_at", "r.updated_at"), "desc")
    .orderBy("r.id")
    .execute();
}

async function listUpcomingOverrides(db: Db, piUserId: string, now: Date): Promise<UpcomingOverride[]> {
  const rows = await db
    .selectFrom("blocks as b")
    .innerJoin("too_requests as r", "r.id", "b.too_request_id")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .innerJoin("telescopes as t", "t.id", "b.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["r.id", "r.target_name", "p.code as program_code", "t.code", "t.name", "s.name as site_name", "s.time_zone", "b.starts_at", "b.ends_at"])
    .where("r.pi_user_id", "=", piUserId)
    .where("r.state", "=", "approved")
    .where("b.ends_at", ">", now)
    .orderBy("b.starts_at")
    .execute();
  return rows.map((r) => ({
    requestId: r.id,
    targetName: r.target_name,
    programCode: r.program_code,
    telescope: { code: r.code, name: r.name },
    site: { name: r.site_name, timeZone: r.time_zone },
    startsAt: r.starts_at,
    endsAt: r.ends_at,
  }));
}
