/**
 * Approving a request: one transaction splices the override into the schedule, books
 * the ledger, records the decision and the audit trail, logs the change for tonight's
 * queue and queues every notice. Approving the same slot twice is harmless; two directors
 * approving overlapping slots at once: the database lets exactly one through. A request
 * whose deadline has passed is refused (it lapses instead; see lib/requests/lapse.ts).
 */
import type { Db, Trx } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { getCreditRatio } from "@/lib/ledger/policy";
import { noticeBlockDisplaced, noticeDecisionMade, noticeTonightChanged } from "@/lib/notices/notify";
import { isPastDeadline, lapseOverdueQuietly } from "@/lib/requests/lapse";
import { formatUt, localDate } from "@/lib/time/format";
import type { FeasibilitySnapshot } from "@/lib/requests/feasibility/types";
import { OverrideInTheWayError, spliceOverride, type SpliceResult } from "@/lib/splice/service";
import { scheduleChanged } from "@/lib/schedule/after-write";
import type { User } from "@/lib/users/queries";
import { loadPrograms, loadTelescopeSite } from "./context";
import { DeadlinePassedError, DecisionError, SlotTakenError } from "./errors";
import { lockRequestForDecision } from "./request-row";

export interface ApproveInput {
  requestId: string;
  telescopeId: string;
  start: Date;
  end: Date;
  note?: string;
}

export interface ApproveResult {
  alreadyApproved: boolean;
  tooBlockId: string | null;
  displacedMinutes: number;
}

const MINUTE = 60_000;
const wholeMinute = (d: Date) => new Date(Math.round(d.getTime() / MINUTE) * MINUTE);

function isConstraint(error: unknown, code: string): boolean {
  return (error as { code?: string } | null)?.code === code;
}

/** A slot ending after the target fades past the instrument's limit (the check stored at filing) cannot reach it. */
function refuseAfterFade(feasibility: FeasibilitySnapshot | null, end: Date): void {
  const fading = feasibility?.fading;
  if (!fading) return;
  if (fading.alreadyFainter) throw new DecisionError(`The target was already fainter than ${fading.instrument}'s limit V ${fading.limitingMagnitude.toFixed(1)} when the request was filed: no slot can reach it.`, 409);
  if (fading.fainterThanLimitAt && end.getTime() > Date.parse(fading.fainterThanLimitAt)) {
    throw new DecisionError(
      `The target is predicted to fade past ${fading.instrument}'s limit V ${fading.limitingMagnitude.toFixed(1)} at ${formatUt(new Date(fading.fainterThanLimitAt))} UT: choose a slot that ends by then. Nothing was changed.`,
      409,
    );
  }
}

/** `now` decides whether the deadline has passed (tests pass their own clock). */
export async function approveRequest(db: Db, director: User, input: ApproveInput, now: Date = new Date()): Promise<ApproveResult> {
  const start = wholeMinute(input.start);
  const end = wholeMinute(input.end);
  if (!(end > start)) throw new DecisionError("The slot must end after it starts.", 400);
  try {
    return await db.transaction().execute(async (trx) => {
      const request = await lockRequestForDecision(trx, input.requestId);
      if (!request) throw new DecisionError("No such request.", 404);
      if (request.state === "approved") {
        const granted = await trx.selectFrom("request_decisions").selectAll().where("request_id", "=", request.id).where("decision", "=", "approve").executeTakeFirst();
        const same = granted?.telescope_id === input.telescopeId && granted.slot_start?.getTime() === start.getTime() && granted.slot_end?.getTime() === end.getTime();
        if (!same) throw new DecisionError("This request was already approved for another slot.", 409);
        const block = await trx.selectFrom("blocks").select("id").where("too_request_id", "=", request.id).executeTakeFirst();
        return { alreadyApproved: true, tooBlockId: block?.id ?? null, displacedMinutes: 0 };
      }
      if (request.state === "lapsed" && request.deadline) throw new DeadlinePassedError(request.deadline);
      if (request.state !== "submitted" && request.state !== "in_review") {
        throw new DecisionError(`This request is ${request.state.replace("_", " ")}: it can no longer be approved.`, 409);
      }
      // Before the minute job has lapsed it: refuse all the same.
      if (isPastDeadline(request.deadline, now)) throw new DeadlinePassedError(request.deadline ?? now);
      if (!request.program_id || !request.semester_id || !request.partner_id) throw new DecisionError("The request has no program to charge.", 400);
      refuseAfterFade(request.feasibility as FeasibilitySnapshot | null, end);
      const acceptable = await trx.selectFrom("too_request_telescopes").select("telescope_id").where("request_id", "=", request.id).execute();
      if (!acceptable.some((a) => a.telescope_id === input.telescopeId)) throw new DecisionError("The PI did not accept that telescope for this request.", 400);
      const telescope = await loadTelescopeSite(trx, input.telescopeId);
      if (!telescope) throw new DecisionError("No such telescope.", 404);

      const splice = await spliceOverride(trx, {
        telescopeId: input.telescopeId,
        start,
        end,
        requestId: request.id,
        programId: request.program_id,
        instrumentId: request.instrument_id,
        observerUserId: request.pi_user_id,
        notes: `Override for ${request.target_name}`,
        actorUserId: director.id,
        targetName: request.target_name,
      });
      await bookLedger(trx, director, request, splice, (end.getTime() - start.getTime()) / MINUTE);

      await trx.updateTable("too_requests").set({ state: "approved", director_note: input.note ?? null, updated_at: new Date() }).where("id", "=", request.id).execute();
      await trx.insertInto("request_events").values({ request_id: request.id, actor_user_id: director.id, from_state: request.state, to_state: "approved", note: input.note ?? "" }).execute();
      await trx
        .insertInto("request_decisions")
        .values({ request_id: request.id, decision: "approve", telescope_id: input.telescopeId, slot_start: start, slot_end: end, note: input.note ?? "", decided_by: director.id })
        .execute();

      const programs = await loadPrograms(trx, [...new Set(splice.displacements.map((d) => d.programId))]);
      await trx
        .insertInto("schedule_changes")
        .values([
          { telescope_id: input.telescopeId, kind: "override", block_id: splice.tooBlockId, request_id: request.id, starts_at: start, ends_at: end, summary: `Override for ${request.target_name} (${request.program_code ?? "ToO"})` },
          ...splice.displacements.map((d) => ({
            telescope_id: input.telescopeId,
            kind: "displaced" as const,
            block_id: d.blockId,
            request_id: request.id,
            starts_at: d.lostStart,
            ends_at: d.lostEnd,
            summary: `${programs.get(d.programId)?.code ?? "A program"} loses ${Math.round(d.minutes)} min (${d.change.replace("-", " ")})`,
          })),
        ])
        .execute();
      await writeAudit(trx, {
        actorUserId: director.id,
        action: "request.approve",
        entity: "too_request",
        entityId: request.id,
        details: { telescopeId: input.telescopeId, start, end, tooBlockId: splice.tooBlockId, displacedMinutes: splice.displacedMinutes },
      });

      const site = { code: telescope.site_code, name: telescope.site_name, timeZone: telescope.time_zone };
      const telescopeRef = { code: telescope.code, name: telescope.name };
      const contact = { name: director.name, email: director.email };
      await noticeDecisionMade(trx, {
        requestId: request.id,
        piUserId: request.pi_user_id,
        targetName: request.target_name,
        programCode: request.program_code ?? "ToO",
        decision: "approved",
        reason: input.note?.trim() || "Approved.",
        decidedBy: contact,
        decidedAt: new Date(),
        site,
        slot: { telescope: telescopeRef, startsAt: start, endsAt: end },
        displacedMinutes: Math.round(splice.displacedMinutes),
      });
      const ratio = await getCreditRatio(trx);
      for (const d of splice.displacements) {
        const program = programs.get(d.programId);
        if (!d.observerUserId || !program) continue;
        const remaining = [
          ...(d.blockStart < d.lostStart ? [{ startsAt: d.blockStart, endsAt: d.lostStart }] : []),
          ...(d.blockEnd > d.lostEnd ? [{ startsAt: d.lostEnd, endsAt: d.blockEnd }] : []),
        ];
        await noticeBlockDisplaced(trx, {
          displacementId: d.id,
          observerUserId: d.observerUserId,
          requestId: request.id,
          targetName: request.target_name,
          programCode: program.code,
          programTitle: program.title,
          telescope: telescopeRef,
          site,
          block: { startsAt: d.blockStart, endsAt: d.blockEnd },
          lost: [{ startsAt: d.lostStart, endsAt: d.lostEnd }],
          lostMinutes: Math.max(1, Math.round(d.minutes)),
          remaining,
          owedHours: Math.round(((d.minutes * ratio) / 60) * 100) / 100,
          contact,
        });
      }
      await noticeTonightChanged(trx, {
        changeId: splice.tooBlockId,
        telescopeId: input.telescopeId,
        telescope: telescopeRef,
        site,
        nightOf: localDate(new Date(start.getTime() - 12 * 3_600_000), telescope.time_zone),
        targetName: request.target_name,
        changes: [
          { kind: "added", programCode: request.program_code ?? "ToO", label: request.target_name, startsAt: start, endsAt: end },
          ...splice.displacements.map((d) => ({
            kind: d.change === "remove" ? ("removed" as const) : d.change === "split" ? ("split" as const) : ("shortened" as const),
            programCode: programs.get(d.programId)?.code ?? "—",
            label: `${Math.round(d.minutes)} min to the override`,
            startsAt: d.lostStart,
            endsAt: d.lostEnd,
          })),
        ],
      });
      return { alreadyApproved: false, tooBlockId: splice.tooBlockId, displacedMinutes: splice.displacedMinutes };
    }).finally(scheduleChanged); // the schedule answers and tonight's queue must show the override at once
  } catch (error) {
    if (error instanceof DeadlinePassedError) {
      // The refusal rolled back; lapse it now so the review page shows it lapsed at once.
      await lapseOverdueQuietly(db, now);
      throw error;
    }
    if (isConstraint(error, "23P01") || error instanceof OverrideInTheWayError) throw new SlotTakenError();
    if (isConstraint(error, "23505")) throw new SlotTakenError(" for this request");
    throw error;
  }
}

async function bookLedger(
  trx: Trx,
  director: User,
  request: { id: string; program_id: string | null; semester_id: string | null; partner_id: string | null },
  splice: SpliceResult,
  slotMinutes: number,
): Promise<void> {
  const ratio = await getCreditRatio(trx);
  const programs = await loadPrograms(trx, [...new Set(splice.displacements.map((d) => d.programId))]);
  const entries = [
    {
      semester_id: request.semester_id ?? "",
      program_id: request.program_id ?? "",
      partner_id: request.partner_id ?? "",
      kind: "charge" as const,
      minutes: slotMinutes,
      request_id: request.id,
      block_id: splice.tooBlockId,
      note: "Override time used",
      created_by: director.id,
    },
    ...splice.displacements
      .filter(() => ratio > 0)
      .map((d) => {
        const program = programs.get(d.programId);
        return {
          semester_id: program?.semesterId ?? "",
          program_id: d.programId,
          partner_id: program?.partnerId ?? "",
          kind: "credit" as const,
          minutes: d.minutes * ratio,
          request_id: request.id,
          displacement_id: d.id,
          block_id: d.blockId,
          note: `Displaced by an override (${ratio}:1)`,
          created_by: director.id,
        };
      }),
  ];
  await trx.insertInto("ledger_entries").values(entries).execute();
}
