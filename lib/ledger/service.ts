/**
 * The ledger as a viewer may see it: directors and admins see every program; PIs and
 * observers see the programs they lead, observe or lost time on.
 */
import type { Db } from "@/db/index";
import type { Role } from "@/db/types";
import { summarizeLedger, type LedgerSummary } from "./balances";
import { getCreditRatio } from "./policy";
import { listLedgerProgramIdsFor, listLedgerRows } from "./queries";

export interface LedgerViewer {
  id: string;
  roles: readonly Role[];
}

export function seesWholeLedger(viewer: LedgerViewer): boolean {
  return viewer.roles.includes("director") || viewer.roles.includes("admin");
}

export function mayScheduleTheLedger(viewer: LedgerViewer): boolean {
  return seesWholeLedger(viewer);
}

export interface LedgerView extends LedgerSummary {
  creditRatio: number;
  scope: "all" | "mine";
}

export async function getLedger(db: Db, viewer: LedgerViewer, filter: { semesterId?: string; partnerId?: string } = {}): Promise<LedgerView> {
  const all = seesWholeLedger(viewer);
  const programIds = all ? undefined : await listLedgerProgramIdsFor(db, viewer.id);
  const [rows, creditRatio] = await Promise.all([listLedgerRows(db, { ...filter, programIds }), getCreditRatio(db)]);
  return { ...summarizeLedger(rows), creditRatio, scope: all ? "all" : "mine" };
}
