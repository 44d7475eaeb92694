/**
 * Writing semesters. Programs belong to a semester, so a semester with programs cannot be
 * deleted, and its dates cannot shrink past blocks its programs already have. Semesters
 * never share time (the ledger's per-semester balances count on it): the check here names
 * the one in the way, and the exclusion constraint `semesters_no_overlap` holds against a
 * concurrent save, whose refusal gets the same message.
 */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { formatUt } from "@/lib/time/format";
import {
  countBlocksOutside,
  deleteSemesterById,
  findOverlappingSemester,
  findSemesterIdByCode,
  insertSemester,
  lockSemester,
  updateSemesterById,
  type Semester,
} from "./queries";
import type { SemesterInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `A semester with the code ${code} already exists.`);

/** Beside the end when the other semester begins inside this one, else beside the start. */
function overlaps(input: SemesterInput, other: Pick<Semester, "code" | "startsAt" | "endsAt">): FieldError {
  return new FieldError(
    other.startsAt > input.startsAt ? "endsAt" : "startsAt",
    `Overlaps ${other.code} (${formatUt(other.startsAt)} to ${formatUt(other.endsAt)} UT): semesters may not share time. Nothing was saved.`,
  );
}

async function assertCodeFree(trx: Trx, code: string, selfId?: string): Promise<void> {
  const holder = await findSemesterIdByCode(trx, code);
  if (holder && holder !== selfId) throw codeTaken(code);
}

async function assertNoOverlap(trx: Trx, input: SemesterInput, selfId?: string): Promise<void> {
  const other = await findOverlappingSemester(trx, input.startsAt, input.endsAt, selfId);
  if (other) throw overlaps(input, other);
}

function isSemesterOverlap(error: unknown): boolean {
  const e = error as { code?: string; constraint?: string } | null;
  return e?.code === "23P01" && e.constraint === "semesters_no_overlap";
}

/** Runs a save, turning the database's refusals (a concurrent save won the race) into the checks' messages. */
async function refuseConflicts<T>(db: Db, input: SemesterInput, selfId: string | undefined, save: () => Promise<T>): Promise<T> {
  try {
    return await refuseDuplicates(save, () => codeTaken(input.code));
  } catch (error) {
    if (!isSemesterOverlap(error)) throw error;
    const other = await findOverlappingSemester(db, input.startsAt, input.endsAt, selfId);
    throw other ? overlaps(input, other) : new FieldError("startsAt", "Another semester was saved over these dates at the same moment. Nothing was saved: try again.");
  }
}

export async function createSemester(db: Db, actorId: string, input: SemesterInput): Promise<string> {
  const work = async (trx: Trx) => {
    await assertCodeFree(trx, input.code);
    await assertNoOverlap(trx, input);
    const id = await insertSemester(trx, input);
    await writeAudit(trx, { actorUserId: actorId, action: "semester.create", entity: "semester", entityId: id, details: { after: input } });
    return id;
  };
  return refuseConflicts(db, input, undefined, () => db.transaction().execute(work));
}

export async function updateSemester(db: Db, actorId: string, id: string, input: SemesterInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockSemester(trx, id);
    if (!before) throw new RecordNotFoundError("semester");
    await assertCodeFree(trx, input.code, id);
    await assertNoOverlap(trx, input, id);
    const outside = await countBlocksOutside(trx, id, input.startsAt, input.endsAt);
    const stranded = outside.early || outside.late;
    if (stranded > 0) {
      const blocks = stranded === 1 ? "1 block" : `${stranded} blocks`;
      const when = outside.early ? "before the new start" : "after the new end";
      throw new FieldError(outside.early ? "startsAt" : "endsAt", `${blocks} of this semester's programs would fall ${when}: move them first. Nothing was saved.`);
    }
    await updateSemesterById(trx, id, input);
    await writeAudit(trx, { actorUserId: actorId, action: "semester.update", entity: "semester", entityId: id, details: { before, after: input } });
  };
  await refuseConflicts(db, input, id, () => db.transaction().execute(work));
}

export async function deleteSemester(db: Db, actorId: string, id: string): Promise<void> {
  const work = async (trx: Trx) => {
    const semester = await lockSemester(trx, id);
    if (!semester) throw new RecordNotFoundError("semester");
    if (semester.programCount > 0) {
      const programs = semester.programCount === 1 ? "1 program" : `${semester.programCount} programs`;
      throw new RecordInUseError(`Semester ${semester.code} still has ${programs}: delete or move them first. Nothing was deleted.`);
    }
    await deleteSemesterById(trx, id);
    await writeAudit(trx, { actorUserId: actorId, action: "semester.delete", entity: "semester", entityId: id, details: { before: semester } });
  };
  try {
    await db.transaction().execute(work);
  } catch (error) {
    if (isForeignKeyViolation(error)) throw new RecordInUseError("That semester now has a program. Nothing was deleted.");
    throw error;
  }
}
