/**
 * Writing telescopes and who assists at them. A telescope with scheduled blocks cannot be
 * deleted: the schedule, the ledger and feeds would lose their anchor. Its instruments and
 * assistant assignments go with it when it has none.
 */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { assertPeopleHaveRole } from "@/lib/users/role-rules";
import {
  deleteTelescopeById,
  findTelescopeIdByCode,
  insertTelescope,
  lockTelescope,
  replaceTelescopeAssistants,
  updateTelescopeById,
} from "./queries";
import type { TelescopeInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `A telescope with the code ${code} already exists.`);

async function checkInput(trx: Trx, input: TelescopeInput, selfId?: string): Promise<void> {
  // FOR SHARE: the site cannot be deleted while this transaction points a telescope at it.
  const site = await trx.selectFrom("sites").select("id").where("id", "=", input.siteId).forShare().executeTakeFirst();
  if (!site) throw new FieldError("siteId", "That site no longer exists: choose another.");
  const holder = await findTelescopeIdByCode(trx, input.code);
  if (holder && holder !== selfId) throw codeTaken(input.code);
  await assertPeopleHaveRole(trx, input.assistantUserIds, "night_assistant", "assistantUserIds");
}

export async function createTelescope(db: Db, actorId: string, input: TelescopeInput): Promise<string> {
  const work = async (trx: Trx) => {
    await checkInput(trx, input);
    const id = await insertTelescope(trx, input);
    await replaceTelescopeAssistants(trx, id, input.assistantUserIds);
    await writeAudit(trx, { actorUserId: actorId, action: "telescope.create", entity: "telescope", entityId: id, details: { after: input } });
    return id;
  };
  return refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function updateTelescope(db: Db, actorId: string, id: string, input: TelescopeInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockTelescope(trx, id);
    if (!before) throw new RecordNotFoundError("telescope");
    await checkInput(trx, input, id);
    await updateTelescopeById(trx, id, input);
    await replaceTelescopeAssistants(trx, id, input.assistantUserIds);
    await writeAudit(trx, { actorUserId: actorId, action: "telescope.update", entity: "telescope", entityId: id, details: { before, after: input } });
  };
  await refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function deleteTelescope(db: Db, actorId: string, id: string): Promise<void> {
  const work = async (trx: Trx) => {
    const telescope = await lockTelescope(trx, id);
    if (!telescope) throw new RecordNotFoundError("telescope");
    if (telescope.blockCount > 0) {
      const count = telescope.blockCount === 1 ? "1 scheduled block" : `${telescope.blockCount} scheduled blocks`;
      throw new RecordInUseError(`Telescope ${telescope.code} still has ${count}: it cannot be deleted while it has a schedule. Nothing was deleted.`);
    }
    await deleteTelescopeById(trx, id);
    await writeAudit(trx, { actorUserId: actorId, action: "telescope.delete", entity: "telescope", entityId: id, details: { before: telescope } });
  };
  try {
    await db.transaction().execute(work);
  } catch (error) {
    // A block added meanwhile, or a block or ToO request that names it or one of its instruments.
    if (isForeignKeyViolation(error)) throw new RecordInUseError("That telescope or one of its instruments is still named by blocks or ToO requests. Nothing was deleted.");
    throw error;
  }
}
