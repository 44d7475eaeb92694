/** Writing partners. A partner with programs cannot be deleted: the ledger balances per partner. */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { deletePartnerById, findPartnerIdByCode, insertPartner, lockPartner, updatePartnerById } from "./queries";
import type { PartnerInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `A partner with the code ${code} already exists.`);

async function assertCodeFree(trx: Trx, code: string, selfId?: string): Promise<void> {
  const holder = await findPartnerIdByCode(trx, code);
  if (holder && holder !== selfId) throw codeTaken(code);
}

export async function createPartner(db: Db, actorId: string, input: PartnerInput): Promise<string> {
  const work = async (trx: Trx) => {
    await assertCodeFree(trx, input.code);
    const id = await insertPartner(trx, input);
    await writeAudit(trx, { actorUserId: actorId, action: "partner.create", entity: "partner", entityId: id, details: { after: input } });
    return id;
  };
  return refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function updatePartner(db: Db, actorId: string, id: string, input: PartnerInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockPartner(trx, id);
    if (!before) throw new RecordNotFoundError("partner");
    await assertCodeFree(trx, input.code, id);
    await updatePartnerById(trx, id, input);
    await writeAudit(trx, { actorUserId: actorId, action: "partner.update", entity: "partner", entityId: id, details: { before, after: input } });
  };
  await refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function deletePartner(db: Db, actorId: string, id: string): Promise<void> {
  const work = async (trx: Trx) => {
    const partner = await lockPartner(trx, id);
    if (!partner) throw new RecordNotFoundError("partner");
    if (partner.programCount > 0) {
      const programs = partner.programCount === 1 ? "1 program" : `${partner.programCount} programs`;
      throw new RecordInUseError(`Partner ${partner.code} still has ${programs}: delete or move them first. Nothing was deleted.`);
    }
    await deletePartnerById(trx, id);
    await writeAudit(trx, { actorUserId: actorId, action: "partner.delete", entity: "partner", entityId: id, details: { before: partner } });
  };
  try {
    await db.transaction().execute(work);
  } catch (error) {
    if (isForeignKeyViolation(error)) throw new RecordInUseError("That partner now has a program. Nothing was deleted.");
    throw error;
  }
}
