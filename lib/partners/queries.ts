import type { Db, Trx } from "@/db/index";
import type { PartnerInput } from "./schemas";

export interface Partner {
  id: string;
  code: string;
  name: string;
  programCount: number;
}

export interface PartnerOption {
  id: string;
  code: string;
  name: string;
}

function partnersQuery(db: Db | Trx) {
  return db
    .selectFrom("partners as pa")
    .select((eb) => [
      "pa.id",
      "pa.code",
      "pa.name",
      eb.selectFrom("programs as p").select(eb.fn.countAll<number>().as("n")).whereRef("p.partner_id", "=", "pa.id").as("program_count"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof partnersQuery>["execute"]>>[number];

function toPartner(r: Row): Partner {
  return { id: r.id, code: r.code, name: r.name, programCount: Number(r.program_count ?? 0) };
}

export async function listPartners(db: Db): Promise<Partner[]> {
  return (await partnersQuery(db).orderBy("pa.code").execute()).map(toPartner);
}

export async function findPartnerById(db: Db | Trx, id: string): Promise<Partner | undefined> {
  const row = await partnersQuery(db).where("pa.id", "=", id).executeTakeFirst();
  return row && toPartner(row);
}

export async function listPartnerOptions(db: Db): Promise<PartnerOption[]> {
  return db.selectFrom("partners").select(["id", "code", "name"]).orderBy("code").execute();
}

export async function findPartnerIdByCode(trx: Db | Trx, code: string): Promise<string | undefined> {
  return (await trx.selectFrom("partners").select("id").where("code", "=", code).executeTakeFirst())?.id;
}

export async function lockPartner(trx: Trx, id: string): Promise<Partner | undefined> {
  const locked = await trx.selectFrom("partners").select("id").where("id", "=", id).forUpdate().executeTakeFirst();
  return locked && findPartnerById(trx, id);
}

export async function insertPartner(trx: Trx, input: PartnerInput): Promise<string> {
  return (await trx.insertInto("partners").values({ code: input.code, name: input.name }).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updatePartnerById(trx: Trx, id: string, input: PartnerInput): Promise<void> {
  await trx.updateTable("partners").set({ code: input.code, name: input.name }).where("id", "=", id).execute();
}

export async function deletePartnerById(trx: Trx, id: string): Promise<void> {
  await trx.deleteFrom("partners").where("id", "=", id).execute();
}
