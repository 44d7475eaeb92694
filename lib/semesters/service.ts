/**
 * Writing semesters. Programs belong to a semester, so a semester with programs cannot be
 * deleted, and its dates cannot shrink past blocks its programs already have.
 */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { countBlocksOutside, deleteSemesterById, findSemesterIdByCode, insertSemester, lockSemester, updateSemesterById } from "./queries";
import type { SemesterInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `A semester with the code ${code} already exists.`);

async function assertCodeFree(trx: Trx, code: string, selfId?: string): Promise<void> {
  const holder = await findSemesterIdByCode(trx, code);
  if (holder && holder !== selfId) throw codeTaken(code);
}

export async function createSemester(db: Db, actorId: string, input: SemesterInput): Promise<string> {
  const work = async (trx: Trx) => {
    await assertCodeFree(trx, input.code);
    const id = await insertSemester(trx, input);
    await writeAudit(trx, { actorUserId: actorId, action: "semester.create", entity: "semester", entityId: id, details: { after: input } });
    return id;
  };
  return refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function updateSemester(db: Db, actorId: string, id: string, input: SemesterInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockSemester(trx, id);
    if (!before) throw new RecordNotFoundError("semester");
    await assertCodeFree(trx, input.code, id);
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
  await refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
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
