import type { Trx } from "@/db/index";

/** Telescope, site and the programs touched, as the notices and ledger need them. */
export async function loadTelescopeSite(trx: Trx, telescopeId: string) {
  return trx
    .selectFrom("telescopes as t")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "s.code as site_code", "s.name as site_name", "s.time_zone"])
    .where("t.id", "=", telescopeId)
    .executeTakeFirst();
}

export async function loadPrograms(trx: Trx, ids: string[]) {
  if (!ids.length) return new Map<string, { code: string; title: string; semesterId: string; partnerId: string }>();
  const rows = await trx.selectFrom("programs").select(["id", "code", "title", "semester_id", "partner_id"]).where("id", "in", ids).execute();
  return new Map(rows.map((r) => [r.id, { code: r.code, title: r.title, semesterId: r.semester_id, partnerId: r.partner_id }]));
}
