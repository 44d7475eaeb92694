import type { Db, Trx } from "@/db/index";

/** Minutes credited per minute displaced: the consortium's policy, 1:1 unless changed in consortium_settings. */
export async function getCreditRatio(db: Db | Trx): Promise<number> {
  const row = await db.selectFrom("consortium_settings").select("value").where("key", "=", "credit_ratio").executeTakeFirst();
  const ratio = Number(row?.value ?? 1);
  return Number.isFinite(ratio) && ratio >= 0 ? ratio : 1;
}

export async function getInterruptSetupMinutes(db: Db | Trx): Promise<number> {
  const row = await db.selectFrom("consortium_settings").select("value").where("key", "=", "interrupt_setup_minutes").executeTakeFirst();
  const minutes = Number(row?.value ?? 10);
  return Number.isFinite(minutes) && minutes >= 0 ? minutes : 10;
}
