/** Ledger fixtures: the credit ratio setting (restored after use) and ledger sums read straight from the rows. */
import { getDb } from "@/db/index";

export async function setCreditRatio(ratio: number): Promise<void> {
  await getDb().updateTable("consortium_settings").set({ value: JSON.stringify(ratio) }).where("key", "=", "credit_ratio").execute();
}

export async function ledgerMinutes(filter: { programId?: string; requestId?: string; kind: "charge" | "credit" | "repay" }): Promise<number> {
  let q = getDb().selectFrom("ledger_entries").select("minutes").where("kind", "=", filter.kind);
  if (filter.programId) q = q.where("program_id", "=", filter.programId);
  if (filter.requestId) q = q.where("request_id", "=", filter.requestId);
  const rows = await q.execute();
  return rows.reduce((sum, r) => sum + r.minutes, 0);
}

export async function displacedMinutes(filter: { programId?: string; requestId?: string }): Promise<number> {
  let q = getDb().selectFrom("displacements").select("minutes");
  if (filter.programId) q = q.where("program_id", "=", filter.programId);
  if (filter.requestId) q = q.where("request_id", "=", filter.requestId);
  const rows = await q.execute();
  return rows.reduce((sum, r) => sum + r.minutes, 0);
}
