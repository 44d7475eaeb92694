/**
 * Writing instruments. Codes are unique per telescope. Blocks name the instrument they
 * use, so an instrument in use can neither be deleted nor moved to another telescope
 * (the blocks would then name an instrument their telescope does not carry).
 */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { deleteInstrumentById, findInstrumentIdByCode, insertInstrument, lockInstrument, updateInstrumentById } from "./queries";
import type { InstrumentInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `This telescope already has an instrument with the code ${code}.`);

const blocksPhrase = (n: number) => (n === 1 ? "1 scheduled block" : `${n} scheduled blocks`);

async function checkInput(trx: Trx, input: InstrumentInput, selfId?: string): Promise<void> {
  const telescope = await trx.selectFrom("telescopes").select("id").where("id", "=", input.telescopeId).forShare().executeTakeFirst();
  if (!telescope) throw new FieldError("telescopeId", "That telescope no longer exists: choose another.");
  const holder = await findInstrumentIdByCode(trx, input.telescopeId, input.code);
  if (holder && holder !== selfId) throw codeTaken(input.code);
}

export async function createInstrument(db: Db, actorId: string, input: InstrumentInput): Promise<string> {
  const work = async (trx: Trx) => {
    await checkInput(trx, input);
    const id = await insertInstrument(trx, input);
    await writeAudit(trx, { actorUserId: actorId, action: "instrument.create", entity: "instrument", entityId: id, details: { after: input } });
    return id;
  };
  return refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function updateInstrument(db: Db, actorId: string, id: string, input: InstrumentInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockInstrument(trx, id);
    if (!before) throw new RecordNotFoundError("instrument");
    if (before.telescopeId !== input.telescopeId && before.blockCount > 0) {
      throw new FieldError(
        "telescopeId",
        `${before.code} is used by ${blocksPhrase(before.blockCount)} on ${before.telescopeCode}: it cannot move to another telescope. Create a new instrument instead.`,
      );
    }
    await checkInput(trx, input, id);
    await updateInstrumentById(trx, id, input);
    await writeAudit(trx, { actorUserId: actorId, action: "instrument.update", entity: "instrument", entityId: id, details: { before, after: input } });
  };
  await refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function deleteInstrument(db: Db, actorId: string, id: string): Promise<void> {
  const work = async (trx: Trx) => {
    const instrument = await lockInstrument(trx, id);
    if (!instrument) throw new RecordNotFoundError("instrument");
    if (instrument.blockCount > 0) {
      throw new RecordInUseError(`${instrument.telescopeCode} ${instrument.code} is used by ${blocksPhrase(instrument.blockCount)}. Nothing was deleted.`);
    }
    await deleteInstrumentById(trx, id);
    await writeAudit(trx, { actorUserId: actorId, action: "instrument.delete", entity: "instrument", entityId: id, details: { before: instrument } });
  };
  try {
    await db.transaction().execute(work);
  } catch (error) {
    if (isForeignKeyViolation(error)) throw new RecordInUseError("That instrument is still named by a block or a ToO request. Nothing was deleted.");
    throw error;
  }
}
