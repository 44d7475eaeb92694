import type { Db, Trx } from "@/db/index";
import type { InstrumentInput } from "./schemas";

export interface Instrument {
  id: string;
  telescopeId: string;
  telescopeCode: string;
  code: string;
  name: string;
  limitingMagnitude: number;
  blockCount: number;
}

function instrumentsQuery(db: Db | Trx) {
  return db
    .selectFrom("instruments as i")
    .innerJoin("telescopes as t", "t.id", "i.telescope_id")
    .select((eb) => [
      "i.id",
      "i.telescope_id",
      "t.code as telescope_code",
      "i.code",
      "i.name",
      "i.limiting_magnitude",
      eb.selectFrom("blocks as b").select(eb.fn.countAll<number>().as("n")).whereRef("b.instrument_id", "=", "i.id").as("block_count"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof instrumentsQuery>["execute"]>>[number];

function toInstrument(r: Row): Instrument {
  return {
    id: r.id,
    telescopeId: r.telescope_id,
    telescopeCode: r.telescope_code,
    code: r.code,
    name: r.name,
    limitingMagnitude: r.limiting_magnitude,
    blockCount: Number(r.block_count ?? 0),
  };
}

export async function listInstruments(db: Db): Promise<Instrument[]> {
  return (await instrumentsQuery(db).orderBy("t.code").orderBy("i.code").execute()).map(toInstrument);
}

export async function findInstrumentById(db: Db | Trx, id: string): Promise<Instrument | undefined> {
  const row = await instrumentsQuery(db).where("i.id", "=", id).executeTakeFirst();
  return row && toInstrument(row);
}

/** Codes are unique per telescope: two telescopes may each have a "CAM". */
export async function findInstrumentIdByCode(trx: Db | Trx, telescopeId: string, code: string): Promise<string | undefined> {
  const row = await trx.selectFrom("instruments").select("id").where("telescope_id", "=", telescopeId).where("code", "=", code).executeTakeFirst();
  return row?.id;
}

export async function lockInstrument(trx: Trx, id: string): Promise<Instrument | undefined> {
  const locked = await trx.selectFrom("instruments").select("id").where("id", "=", id).forUpdate().executeTakeFirst();
  return locked && findInstrumentById(trx, id);
}

function columns(input: InstrumentInput) {
  return { telescope_id: input.telescopeId, code: input.code, name: input.name, limiting_magnitude: input.limitingMagnitude };
}

export async function insertInstrument(trx: Trx, input: InstrumentInput): Promise<string> {
  return (await trx.insertInto("instruments").values(columns(input)).returning("id").executeTakeFirstOrThrow()).id;
}

export async function updateInstrumentById(trx: Trx, id: string, input: InstrumentInput): Promise<void> {
  await trx.updateTable("instruments").set(columns(input)).where("id", "=", id).execute();
}

export async function deleteInstrumentById(trx: Trx, id: string): Promise<void> {
  await trx.deleteFrom("instruments").where("id", "=", id).execute();
}
