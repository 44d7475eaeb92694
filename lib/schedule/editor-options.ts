import type { Db } from "@/db/index";
import type { NewBlockOptions } from "@/components/schedule/new-block-form";

/** What an admin can pick from when adding a block on the calendar. */
export async function getBlockEditorOptions(db: Db): Promise<NewBlockOptions> {
  const [programs, observers, instruments] = await Promise.all([
    db.selectFrom("programs").select(["id", "code", "title", "category"]).orderBy("code").execute(),
    db
      .selectFrom("users as u")
      .innerJoin("user_roles as r", "r.user_id", "u.id")
      .select(["u.id", "u.name"])
      .where("r.role", "=", "observer")
      .where("u.disabled_at", "is", null)
      .orderBy("u.name")
      .execute(),
    db.selectFrom("instruments").select(["id", "code", "name", "telescope_id"]).orderBy("code").execute(),
  ]);
  return {
    programs,
    observers,
    instruments: instruments.map((i) => ({ id: i.id, code: i.code, name: i.name, telescopeId: i.telescope_id })),
  };
}
