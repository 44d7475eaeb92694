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

/** The site of the request's first acceptable telescope (by code): decline and return notices show its local time. */
export async function loadFirstSite(trx: Trx, requestId: string): Promise<{ code: string; name: string; timeZone: string }> {
  const site = await trx
    .selectFrom("too_request_telescopes as rt")
    .innerJoin("telescopes as t", "t.id", "rt.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["s.code", "s.name", "s.time_zone"])
    .where("rt.request_id", "=", requestId)
    .orderBy("t.code")
    .executeTakeFirst();
  return { code: site?.code ?? "—", name: site?.name ?? "—", timeZone: site?.time_zone ?? "UTC" };
}

export async function loadPrograms(trx: Trx, ids: string[]) {
  if (!ids.length) return new Map<string, { code: string; title: string; semesterId: string; partnerId: string }>();
  const rows = await trx.selectFrom("programs").select(["id", "code", "title", "semester_id", "partner_id"]).where("id", "in", ids).execute();
  return new Map(rows.map((r) => [r.id, { code: r.code, title: r.title, semesterId: r.semester_id, partnerId: r.partner_id }]));
}
