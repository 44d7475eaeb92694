/**
 * The impact of a slot on the schedule as it stands now (read-only): the blocks it would
 * cut into and what each program and observer would lose and be owed.
 */
import type { Db } from "@/db/index";
import { getCreditRatio } from "@/lib/ledger/policy";
import { computeImpact, type SlotImpact } from "./compute";
import { findImpactTelescope, listImpactBlocks, type ImpactTelescope } from "./queries";

export class UnknownTelescopeError extends Error {
  constructor() {
    super("No such telescope.");
  }
}

export interface TelescopeImpact extends SlotImpact {
  telescope: ImpactTelescope;
}

export async function getSlotImpact(db: Db, input: { telescope: string; start: Date; end: Date }): Promise<TelescopeImpact> {
  const telescope = await findImpactTelescope(db, input.telescope);
  if (!telescope) throw new UnknownTelescopeError();
  const [blocks, ratio] = await Promise.all([listImpactBlocks(db, [telescope.id], input.start, input.end), getCreditRatio(db)]);
  return { telescope, ...computeImpact({ start: input.start.getTime(), end: input.end.getTime() }, blocks, ratio) };
}
