/**
 * The requests waiting for a director (submitted or in review, deadline not yet passed),
 * with what the queue shows, and the ones that lapsed lately without a decision.
 */
import { sql } from "kysely";
import type { Db } from "@/db/index";
import { AWAITING_DECISION_STATES, type RequestUrgency } from "@/db/types";
import type { FeasibilitySnapshot } from "@/lib/requests/feasibility/types";
import { orderQueue, type QueueItem } from "./order";

const telescopeCodes = sql<string[]>`coalesce((
  select array_agg(t.code order by t.code)
  from too_request_telescopes rt join telescopes t on t.id = rt.telescope_id
  where rt.request_id = r.id), '{}')`;

export async function listReviewQueue(db: Db, now: Date): Promise<QueueItem[]> {
  const rows = await db
    .selectFrom("too_requests as r")
    .innerJoin("users as u", "u.id", "r.pi_user_id")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .select([
      "r.id",
      "r.state",
      "r.target_name",
      "u.name as pi_name",
      "p.code as program_code",
      "r.urgency",
      "r.deadline",
      "r.submitted_at",
      "r.duration_minutes",
      "r.feasibility",
      telescopeCodes.as("telescope_codes"),
    ])
    .where("r.state", "in", AWAITING_DECISION_STATES)
    // Past its deadline a request is lapsing (the minute job has not reached it yet): it is
    // no longer waiting, and must not sort to the top as the most urgent.
    .where((eb) => eb.or([eb("r.deadline", "is", null), eb("r.deadline", ">=", now)]))
    .execute();
  return orderQueue(
    rows.map((r) => ({
      id: r.id,
      state: r.state,
      targetName: r.target_name,
      piName: r.pi_name,
      programCode: r.program_code,
      urgency: r.urgency,
      deadline: r.deadline,
      submittedAt: r.submitted_at,
      durationMinutes: r.duration_minutes,
      telescopeCodes: r.telescope_codes,
      feasibility: (r.feasibility ?? null) as FeasibilitySnapshot | null,
    })),
    now.getTime(),
  );
}

export interface LapsedItem {
  id: string;
  targetName: string;
  piName: string;
  programCode: string | null;
  urgency: RequestUrgency | null;
  deadline: Date | null;
  durationMinutes: number | null;
  telescopeCodes: string[];
}

/** Requests whose deadline passed within the last `days` days before anyone decided them, the latest deadline first. */
export async function listRecentlyLapsed(db: Db, now: Date, days = 7): Promise<LapsedItem[]> {
  const rows = await db
    .selectFrom("too_requests as r")
    .innerJoin("users as u", "u.id", "r.pi_user_id")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .select(["r.id", "r.target_name", "u.name as pi_name", "p.code as program_code", "r.urgency", "r.deadline", "r.duration_minutes", telescopeCodes.as("telescope_codes")])
    .where("r.state", "=", "lapsed")
    .where("r.deadline", ">=", new Date(now.getTime() - days * 86_400_000))
    .orderBy("r.deadline", "desc")
    .orderBy("r.id")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    targetName: r.target_name,
    piName: r.pi_name,
    programCode: r.program_code,
    urgency: r.urgency,
    deadline: r.deadline,
    durationMinutes: r.duration_minutes,
    telescopeCodes: r.telescope_codes,
  }));
}
