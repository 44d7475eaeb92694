/**
 * Writing sites. A code is unique; a site that still has telescopes cannot be deleted
 * (their schedules, horizons and local times depend on it).
 */
import type { Db, Trx } from "@/db/index";
import { FieldError, RecordInUseError, RecordNotFoundError } from "@/lib/actions/domain-errors";
import { writeAudit } from "@/lib/audit/queries";
import { isForeignKeyViolation, refuseDuplicates } from "@/lib/pg-errors";
import { deleteSiteById, findSiteIdByCode, insertSite, lockSite, updateSiteById } from "./queries";
import type { SiteInput } from "./schemas";

const codeTaken = (code: string) => new FieldError("code", `A site with the code ${code} already exists.`);

async function assertCodeFree(trx: Trx, code: string, selfId?: string): Promise<void> {
  const holder = await findSiteIdByCode(trx, code);
  if (holder && holder !== selfId) throw codeTaken(code);
}

export async function createSite(db: Db, actorId: string, input: SiteInput): Promise<string> {
  const work = async (trx: Trx) => {
    await assertCodeFree(trx, input.code);
    const id = await insertSite(trx, input);
    await writeAudit(trx, { actorUserId: actorId, action: "site.create", entity: "site", entityId: id, details: { after: input } });
    return id;
  };
  return refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function updateSite(db: Db, actorId: string, id: string, input: SiteInput): Promise<void> {
  const work = async (trx: Trx) => {
    const before = await lockSite(trx, id);
    if (!before) throw new RecordNotFoundError("site");
    await assertCodeFree(trx, input.code, id);
    await updateSiteById(trx, id, input);
    await writeAudit(trx, { actorUserId: actorId, action: "site.update", entity: "site", entityId: id, details: { before, after: input } });
  };
  await refuseDuplicates(() => db.transaction().execute(work), () => codeTaken(input.code));
}

export async function deleteSite(db: Db, actorId: string, id: string): Promise<void> {
  const work = async (trx: Trx) => {
    const site = await lockSite(trx, id);
    if (!site) throw new RecordNotFoundError("site");
    if (site.telescopeCount > 0) {
      const count = site.telescopeCount === 1 ? "1 telescope" : `${site.telescopeCount} telescopes`;
      throw new RecordInUseError(`Site ${site.code} still has ${count}: move or delete them first. Nothing was deleted.`);
    }
    await deleteSiteById(trx, id);
    await writeAudit(trx, { actorUserId: actorId, action: "site.delete", entity: "site", entityId: id, details: { before: site } });
  };
  try {
    await db.transaction().execute(work);
  } catch (error) {
    // A telescope added between the check and the delete.
    if (isForeignKeyViolation(error)) throw new RecordInUseError("That site is now in use by a telescope. Nothing was deleted.");
    throw error;
  }
}
