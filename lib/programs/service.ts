/**
 * Writing programs and their observers. The PI must hold the pi role and every observer
 * the observer role; a program with scheduled blocks cannot be deleted (its time and
 * its ledger entries would be orphaned).
 */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { assertPeopleHaveRole } from "@/lib/users/role-rules";
import { deleteProgramById, findProgramIdByCode, insertProgram, lockProgram, replaceProgramObservers, updateProgramById } from "./queries";
import type { ProgramInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `A program with the code ${code} already exists.`);

async function checkInput(trx: Trx, input: ProgramInput, selfId?: string): Promise<void> {
  // FOR SHARE: neither may be deleted while this transaction points a program at it.
  const semester = await trx.selectFrom("semesters").select("id").where("id", "=", input.semesterId).forShare().executeTakeFirst();
  if (!semester) throw new FieldError("semesterId", "That semester no longer exists: choose another.");
  const partner = await trx.selectFrom("partners").select("id").where("id", "=", input.partnerId).forShare().executeTakeFirst();
  if (!partner) throw new FieldError("partnerId", "That partner no longer exists: choose another.");
  const holder = await findProgramIdByCode(trx, input.code);
  if (holder && holder !== selfId) throw codeTaken(input.code);
  await assertPeopleHaveRole(trx, [input.piUserId], "pi", "piUserId");
  await assertPeopleHaveRole(trx, input.observerUserIds, "observer", "observerUserIds");
}

export async function createProgram(db: Db, actorId: string, input: ProgramInput): Promise<string> {
  const work = async (trx: Trx) => {
    await checkInput(trx, input);
    const id = await insertProgram(trx, input);
    await replaceProgramObservers(trx, id, input.observerUserIds);
    await writeAudit(trx, { actorUserId: actorId, action: "program.create", entity: "program", entityId: id, details: { after: input } });
    return id;
  };
  return refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function updateProgram(db: Db, actorId: string, id: string, input: ProgramInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockProgram(trx, id);
    if (!before) throw new RecordNotFoundError("program");
    await checkInput(trx, input, id);
    await updateProgramById(trx, id, input);
    await replaceProgramObservers(trx, id, input.observerUserIds);
    await writeAudit(trx, { actorUserId: actorId, action: "program.update", entity: "program", entityId: id, details: { before, after: input } });
  };
  await refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function deleteProgram(db: Db, actorId: string, id: string): Promise<void> {
  const work = async (trx: Trx) => {
    const program = await lockProgram(trx, id);
    if (!program) throw new RecordNotFoundError("program");
    if (program.blockCount > 0) {
      const blocks = program.blockCount === 1 ? "1 scheduled block" : `${program.blockCount} scheduled blocks`;
      throw new RecordInUseError(`Program ${program.code} still has ${blocks}: remove them from the schedule first. Nothing was deleted.`);
    }
    await deleteProgramById(trx, id);
    await writeAudit(trx, { actorUserId: actorId, action: "program.delete", entity: "program", entityId: id, details: { before: program } });
  };
  try {
    await db.transaction().execute(work);
  } catch (error) {
    if (isForeignKeyViolation(error)) throw new RecordInUseError("That program is still referenced elsewhere (blocks or ToO requests). Nothing was deleted.");
    throw error;
  }
}
