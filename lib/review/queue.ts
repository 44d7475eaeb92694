/** The requests waiting for a director: submitted or in review, with what the queue shows. */
import { sql } from "kysely";
import type { Db } from "@/db/index";
import type { FeasibilitySnapshot } from "@/lib/requests/feasibility/types";
import { orderQueue, type QueueItem } from "./order";

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
      sql<string[]>`coalesce((
        select array_agg(t.code order by t.code)
        from too_request_telescopes rt join telescopes t on t.id = rt.telescope_id
        where rt.request_id = r.id), '{}')`.as("telescope_codes"),
    ])
    .where("r.state", "in", ["submitted", "in_review"])
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
