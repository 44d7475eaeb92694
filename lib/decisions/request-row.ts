import type { Trx } from "@/db/index";

/** The request as the decision needs it, locked for the rest of the transaction. */
export async function lockRequestForDecision(trx: Trx, requestId: string) {
  return trx
    .selectFrom("too_requests as r")
    .innerJoin("users as pi", "pi.id", "r.pi_user_id")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .select([
      "r.id",
      "r.state",
      "r.pi_user_id",
      "r.program_id",
      "r.instrument_id",
      "r.target_name",
      "r.duration_minutes",
      "r.urgency",
      "r.deadline",
      "r.feasibility",
      "pi.name as pi_name",
      "pi.email as pi_email",
      "p.code as program_code",
      "p.semester_id",
      "p.partner_id",
    ])
    .where("r.id", "=", requestId)
    .forUpdate("r")
    .executeTakeFirst();
}

export type LockedRequest = NonNullable<Awaited<ReturnType<typeof lockRequestForDecision>>>;
