import { sql } from "kysely";
import type { Db, Trx } from "@/db/index";
import { instrumentKey, type ExistingBlock, type ImportCatalog } from "./plan-rows";
import type { ImportRow, PlannedBlock } from "./types";

const lowerSet = (values: string[]) => [...new Set(values.filter(Boolean).map((v) => v.toLowerCase()))];

/** Everything the rows name, looked up in a few queries whatever the file's length. */
export async function loadImportCatalog(db: Db | Trx, rows: ImportRow[]): Promise<ImportCatalog> {
  const catalog: ImportCatalog = { telescopes: new Map(), programs: new Map(), users: new Map(), instruments: new Map() };
  const telescopeCodes = lowerSet(rows.map((r) => r.telescope));
  const programCodes = lowerSet(rows.map((r) => r.program));
  const emails = lowerSet(rows.map((r) => r.observerEmail));

  if (telescopeCodes.length) {
    const telescopes = await db
      .selectFrom("telescopes as t")
      .innerJoin("sites as s", "s.id", "t.site_id")
      .select(["t.id", "t.code", "t.name", "s.time_zone"])
      .where(sql<string>`lower(t.code)`, "in", telescopeCodes)
      .execute();
    for (const t of telescopes) catalog.telescopes.set(t.code.toLowerCase(), { id: t.id, code: t.code, name: t.name, timeZone: t.time_zone });
    const ids = telescopes.map((t) => t.id);
    if (ids.length) {
      const instruments = await db.selectFrom("instruments").select(["id", "code", "telescope_id"]).where("telescope_id", "in", ids).execute();
      for (const i of instruments) catalog.instruments.set(instrumentKey(i.telescope_id, i.code), { id: i.id, code: i.code, telescopeId: i.telescope_id });
    }
  }
  if (programCodes.length) {
    const programs = await db
      .selectFrom("programs")
      .select(["id", "code", "title", "category"])
      .where(sql<string>`lower(code)`, "in", programCodes)
      .execute();
    for (const p of programs) catalog.programs.set(p.code.toLowerCase(), p);
  }
  if (emails.length) {
    const users = await db.selectFrom("users").select(["id", "name", "email", "disabled_at"]).where("email", "in", emails).execute();
    for (const u of users) catalog.users.set(u.email, { id: u.id, name: u.name, email: u.email, disabled: u.disabled_at !== null });
  }
  return catalog;
}

/** Blocks on the given telescopes that overlap [from, to). */
export async function listExistingBlocks(db: Db | Trx, telescopeIds: string[], from: Date, to: Date): Promise<ExistingBlock[]> {
  if (!telescopeIds.length) return [];
  const rows = await db
    .selectFrom("blocks as b")
    .innerJoin("programs as p", "p.id", "b.program_id")
    .select(["b.telescope_id", "p.code", "b.starts_at", "b.ends_at"])
    .where("b.telescope_id", "in", telescopeIds)
    .where("b.ends_at", ">", from)
    .where("b.starts_at", "<", to)
    .execute();
  return rows.map((r) => ({ telescopeId: r.telescope_id, programCode: r.code, startsAt: r.starts_at, endsAt: r.ends_at }));
}

const BATCH = 500;

/** Inserts in batches (a bind-parameter limit applies per statement); returns the new ids. */
export async function insertImportedBlocks(trx: Trx, blocks: PlannedBlock[]): Promise<string[]> {
  const ids: string[] = [];
  for (let i = 0; i < blocks.length; i += BATCH) {
    const rows = await trx
      .insertInto("blocks")
      .values(
        blocks.slice(i, i + BATCH).map((b) => ({
          telescope_id: b.telescope.id,
          program_id: b.program.id,
          observer_user_id: b.observer?.id ?? null,
          instrument_id: b.instrument?.id ?? null,
          kind: b.kind,
          starts_at: b.startsAt,
          ends_at: b.endsAt,
          notes: b.notes,
        })),
      )
      .returning("id")
      .execute();
    ids.push(...rows.map((r) => r.id));
  }
  return ids;
}
