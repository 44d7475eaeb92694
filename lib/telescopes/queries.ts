import type { Db } from "@/db/index";

export interface TelescopeSummary {
  id: string;
  code: string;
  name: string;
  siteName: string;
  timeZone: string;
}

export async function listTelescopesForAssistant(db: Db, userId: string): Promise<TelescopeSummary[]> {
  const rows = await db
    .selectFrom("telescope_assistants as ta")
    .innerJoin("telescopes as t", "t.id", "ta.telescope_id")
    .innerJoin("sites as s", "s.id", "t.site_id")
    .select(["t.id", "t.code", "t.name", "s.name as site_name", "s.time_zone"])
    .where("ta.user_id", "=", userId)
    .orderBy("t.code")
    .execute();
  return rows.map((r) => ({ id: r.id, code: r.code, name: r.name, siteName: r.site_name, timeZone: r.time_zone }));
}
