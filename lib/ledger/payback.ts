/**
 * Scheduling a payback block, in one transaction: the program's row is locked (so two
 * paybacks for one program are booked one after the other and can never together repay
 * more than is owed), the block must lie in the dark part of one night at the telescope's
 * site (night-window.ts), the block of kind `payback` is inserted (the exclusion constraint
 * refuses overlaps), a `repay` entry goes on the ledger, a schedule change is logged for
 * tonight's queue, the audit row is written and the observer is told.
 */
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { UserFacingError } from "@/lib/actions/result";
import { RecordNotFoundError } from "@/lib/actions/domain-errors";
import { noticePaybackScheduled } from "@/lib/notices/notify";
import { findOverlappingBlocks } from "@/lib/schedule/queries";
import { BlockConflictError, isOverlapViolation } from "@/lib/schedule/service";
import { formatDuration } from "@/lib/time/format";
import type { User } from "@/lib/users/queries";
import { hours } from "./balances";
import { paybackNightRefusal, type NightRefusal, type PaybackTimeField } from "./night-window";
import { findOwedMinutes, findPaybackTelescope } from "./queries";
import type { PaybackInput } from "./schemas";
import { scheduleChanged } from "@/lib/schedule/after-write";

export class PaybackRefusedError extends UserFacingError {}

/** The block is not wholly in the dark part of one night: shown beside the start and/or end. */
export class PaybackOutsideNightError extends PaybackRefusedError {
  readonly fields: PaybackTimeField[];
  constructor(refusal: NightRefusal) {
    super(refusal.message);
    this.fields = refusal.fields;
  }
}

export interface PaybackResult {
  blockId: string;
  minutes: number;
  owedBeforeMinutes: number;
  owedAfterMinutes: number;
  observerUserId: string | null;
}

const MINUTE = 60_000;
const wholeMinute = (d: Date) => new Date(Math.round(d.getTime() / MINUTE) * MINUTE);
/** Half a second of slack for balances stored as fractions of a minute (credit ratios). */
const SLACK = 1 / 120;

export async function schedulePayback(db: Db, actor: Pick<User, "id" | "name" | "email">, input: PaybackInput): Promise<PaybackResult> {
  const start = wholeMinute(input.startsAt);
  const end = wholeMinute(input.endsAt);
  if (!(end > start)) throw new PaybackRefusedError("The payback block must end after it starts.");
  const minutes = (end.getTime() - start.getTime()) / MINUTE;
  try {
    return await db.transaction().execute(async (trx) => {
      const program = await trx.selectFrom("programs").select(["id", "code", "title", "semester_id", "partner_id"]).where("id", "=", input.programId).forUpdate().executeTakeFirst();
      if (!program) throw new RecordNotFoundError("program");
      const telescope = await findPaybackTelescope(trx, input.telescopeId);
      if (!telescope) throw new RecordNotFoundError("telescope");
      const outsideNight = paybackNightRefusal(telescope.site, start, end);
      if (outsideNight) throw new PaybackOutsideNightError(outsideNight);
      const owed = await findOwedMinutes(trx, program.id, program.semester_id);
      if (owed <= SLACK) throw new PaybackRefusedError(`${program.code} is owed nothing on the ledger: there is no time to repay.`);
      if (minutes > owed + SLACK) {
        throw new PaybackRefusedError(
          `${program.code} is owed ${formatDuration(owed)}; a payback block of ${formatDuration(minutes)} would repay more than that. Shorten it to at most ${formatDuration(Math.floor(owed + SLACK))}. Nothing was saved.`,
        );
      }
      // The observer who lost time most recently gets the payback; else the program's first observer.
      const displaced = await trx.selectFrom("displacements").select("observer_user_id").where("program_id", "=", program.id).where("observer_user_id", "is not", null).orderBy("created_at", "desc").executeTakeFirst();
      const listed = await trx.selectFrom("program_observers").select("user_id").where("program_id", "=", program.id).orderBy("user_id").executeTakeFirst();
      const observerUserId = displaced?.observer_user_id ?? listed?.user_id ?? null;

      const block = await trx
        .insertInto("blocks")
        .values({
          telescope_id: telescope.id,
          program_id: program.id,
          observer_user_id: observerUserId,
          kind: "payback",
          starts_at: start,
          ends_at: end,
          notes: input.note || `Payback for ${program.code}`,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await trx
        .insertInto("ledger_entries")
        .values({
          semester_id: program.semester_id,
          program_id: program.id,
          partner_id: program.partner_id,
          kind: "repay",
          minutes,
          block_id: block.id,
          note: input.note || "Payback block",
          created_by: actor.id,
        })
        .execute();
      await trx
        .insertInto("schedule_changes")
        .values({ telescope_id: telescope.id, kind: "payback", block_id: block.id, starts_at: start, ends_at: end, summary: `Payback block for ${program.code} (${formatDuration(minutes)})` })
        .execute();
      await writeAudit(trx, {
        actorUserId: actor.id,
        action: "ledger.payback",
        entity: "block",
        entityId: block.id,
        details: { programId: program.id, telescopeId: telescope.id, startsAt: start, endsAt: end, minutes, owedBefore: owed },
      });
      if (observerUserId) {
        await noticePaybackScheduled(trx, {
          paybackBlockId: block.id,
          observerUserId,
          programCode: program.code,
          programTitle: program.title,
          telescope: { code: telescope.code, name: telescope.name },
          site: { code: telescope.site.code, name: telescope.site.name, timeZone: telescope.site.timeZone },
          startsAt: start,
          endsAt: end,
          minutes,
          owedBeforeHours: hours(owed),
          owedAfterHours: Math.max(0, hours(owed - minutes)),
          contact: { name: actor.name, email: actor.email },
        });
      }
      return { blockId: block.id, minutes, owedBeforeMinutes: owed, owedAfterMinutes: owed - minutes, observerUserId };
    }).finally(scheduleChanged); // the calendar and tonight's queue show the payback block at once
  } catch (error) {
    if (isOverlapViolation(error)) throw new BlockConflictError(await findOverlappingBlocks(db, input.telescopeId, start, end));
    throw error;
  }
}
