/**
 * A filed request that is still waiting for a decision when its deadline passes lapses:
 * the result would no longer be useful, so it leaves the review queue and the PI is told.
 *
 * Which requests: `submitted` and `in_review` only. Drafts are left alone: they were never
 * filed, so no director was asked and nobody is waiting on them; a draft may be half
 * filled (no deadline at all, which the filed-state CHECK forbids outside `draft`); and a
 * PI who comes back to one can move the deadline and file it, while filing it as it
 * stands is refused by the feasibility check. Approved requests are settled by the night
 * log, never by the clock.
 *
 * Safe to run from several workers and page loads at once: each batch claims its rows
 * with `FOR UPDATE SKIP LOCKED` and changes them with one conditional UPDATE, so a row is
 * lapsed by exactly one transaction; a row another transaction holds (a withdrawal, a
 * decision, a concurrent lapse) is skipped, and seen again next time if still overdue.
 * The history row, the audit row and the PI's notice go in the same transaction.
 */
import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import { AWAITING_DECISION_STATES, type AwaitingDecisionState } from "@/db/types";
import { writeAudit } from "@/lib/audit/queries";
import { noticeRequestLapsed } from "@/lib/notices/notify";
import { insertRequestEvent } from "./queries";

/** Requests lapsed per transaction: keeps row locks short when a backlog builds up (a worker was down). */
const BATCH = 100;

export const LAPSE_NOTE = "The deadline passed before a decision.";

export interface LapsedRequest {
  id: string;
  from: AwaitingDecisionState;
  deadline: Date;
}

/** True when `deadline` has passed at `now` (a request lapses strictly after its deadline). */
export function isPastDeadline(deadline: Date | null, now: Date): boolean {
  return deadline !== null && deadline.getTime() < now.getTime();
}

/**
 * Lapses every overdue request awaiting a decision, in batches of one transaction each.
 * Returns the requests this call lapsed (none when another caller got there first).
 */
export async function lapseOverdueRequests(db: Db, now: Date): Promise<LapsedRequest[]> {
  const all: LapsedRequest[] = [];
  for (;;) {
    const batch = await db.transaction().execute((trx) => lapseOverdueInTransaction(trx, now, BATCH));
    all.push(...batch);
    if (batch.length < BATCH) return all;
  }
}

/**
 * For pages about to show requests, and for a refused approval: lapse whatever is overdue
 * first, so nothing is shown as waiting past its deadline. A failure is logged, never
 * shown to the reader: the minute job (lapse-job.ts) lapses the request anyway.
 */
export async function lapseOverdueQuietly(db: Db, now: Date = new Date()): Promise<void> {
  try {
    await lapseOverdueRequests(db, now);
  } catch (error) {
    console.error("lapsing overdue requests failed:", error instanceof Error ? error.message : error);
  }
}

/** One batch inside the caller's transaction: claim, change, record, tell. */
export async function lapseOverdueInTransaction(trx: Trx, now: Date, limit = BATCH): Promise<LapsedRequest[]> {
  const claimed = await trx
    .with("due", (q) =>
      q
        .selectFrom("too_requests")
        .select(["id", "state"])
        .where("state", "in", AWAITING_DECISION_STATES)
        .where("deadline", "<", now)
        .orderBy("deadline")
        .orderBy("id")
        .limit(limit)
        .forUpdate()
        .skipLocked(),
    )
    .updateTable("too_requests as r")
    .from("due")
    .set({ state: "lapsed", updated_at: now })
    .whereRef("r.id", "=", "due.id")
    // The lock already guarantees it; the condition keeps this UPDATE safe on its own.
    .where("r.state", "in", AWAITING_DECISION_STATES)
    .returning(["r.id", "due.state as from_state", "r.deadline"])
    .execute();
  if (claimed.length === 0) return [];

  const lapsed = claimed.map((r) => ({ id: r.id, from: r.from_state as LapsedRequest["from"], deadline: r.deadline as Date }));
  const facts = await loadLapseFacts(trx, lapsed.map((r) => r.id));
  for (const request of lapsed) {
    await insertRequestEvent(trx, { requestId: request.id, actorUserId: null, from: request.from, to: "lapsed", note: LAPSE_NOTE });
    await writeAudit(trx, { actorUserId: null, action: "request.lapse", entity: "too_request", entityId: request.id, details: { from: request.from, deadline: request.deadline, at: now } });
    const f = facts.get(request.id);
    if (!f) continue;
    await noticeRequestLapsed(trx, {
      requestId: request.id,
      piUserId: f.piUserId,
      targetName: f.targetName,
      programCode: f.programCode,
      urgency: f.urgency,
      fromState: request.from,
      submittedAt: f.submittedAt,
      deadline: request.deadline,
      lapsedAt: now,
      requestedMinutes: f.durationMinutes,
      telescopes: f.telescopes.map((t) => ({ code: t.code, name: t.name })),
      site: f.telescopes[0] ? { code: f.telescopes[0].siteCode, name: f.telescopes[0].siteName, timeZone: f.telescopes[0].timeZone } : { code: "—", name: "—", timeZone: "UTC" },
    });
  }
  return lapsed;
}

interface LapseFacts {
  piUserId: string;
  targetName: string;
  programCode: string;
  urgency: "now" | "tonight" | "within_days";
  submittedAt: Date;
  durationMinutes: number;
  telescopes: { code: string; name: string; siteCode: string; siteName: string; timeZone: string }[];
}

/** What the PI's notice names, for every lapsed request at once. Filed rows have these columns (the filed-state CHECK). */
async function loadLapseFacts(trx: Trx, ids: string[]): Promise<Map<string, LapseFacts>> {
  const rows = await trx
    .selectFrom("too_requests as r")
    .leftJoin("programs as p", "p.id", "r.program_id")
    .select([
      "r.id",
      "r.pi_user_id",
      "r.target_name",
      "p.code as program_code",
      "r.urgency",
      "r.submitted_at",
      "r.duration_minutes",
      "r.updated_at",
      sql<LapseFacts["telescopes"]>`coalesce((
        select json_agg(json_build_object('code', t.code, 'name', t.name, 'siteCode', s.code, 'siteName', s.name, 'timeZone', s.time_zone) order by t.code)
        from too_request_telescopes rt join telescopes t on t.id = rt.telescope_id join sites s on s.id = t.site_id
        where rt.request_id = r.id), '[]'::json)`.as("telescopes"),
    ])
    .where("r.id", "in", ids)
    .execute();
  return new Map(
    rows.map((r) => [
      r.id,
      {
        piUserId: r.pi_user_id,
        targetName: r.target_name.trim() || "an untitled target",
        programCode: r.program_code ?? "ToO",
        urgency: r.urgency ?? "within_days",
        submittedAt: r.submitted_at ?? r.updated_at,
        durationMinutes: Math.max(1, r.duration_minutes ?? 1),
        telescopes: r.telescopes,
      },
    ]),
  );
}
