import type { Db, Trx } from "@/db/index";
import type { SiteInput } from "./schemas";

export interface Site {
  id: string;
  code: string;
  name: string;
  /** Degrees, north positive. */
  latitudeDeg: number;
  /** Degrees, east positive. */
  longitudeDeg: number;
  heightM: number;
  timeZone: string;
  telescopeCount: number;
}

export interface SiteOption {
  id: string;
  code: string;
  name: string;
}

function sitesQuery(db: Db | Trx) {
  return db
    .selectFrom("sites as s")
    .select((eb) => [
      "s.id",
      "s.code",
      "s.name",
      "s.latitude_deg",
      "s.longitude_deg",
      "s.height_m",
      "s.time_zone",
      eb.selectFrom("telescopes as t").select(eb.fn.countAll<number>().as("n")).whereRef("t.site_id", "=", "s.id").as("telescope_count"),
    ]);
}

type Row = Awaited<ReturnType<ReturnType<typeof sitesQuery>["execute"]>>[number];

function toSite(r: Row): Site {
  return {
    id: r.id,
    code: r.code,
    name: r.name,
    latitudeDeg: r.latitude_deg,
    longitudeDeg: r.longitude_deg,
    heightM: r.height_m,
    timeZone: r.time_zone,
    telescopeCount: Number(r.telescope_count ?? 0),
  };
}

export async function listSites(db: Db): Promise<Site[]> {
  return (await sitesQuery(db).orderBy("s.code").execute()).map(toSite);
}

export async function findSiteById(db: Db | Trx, id: string): Promise<Site | undefined> {
  const row = await sitesQuery(db).where("s.id", "=", id).executeTakeFirst();
  return row && toSite(row);
}

export async function listSiteOptions(db: Db): Promise<SiteOption[]> {
  return db.selectFrom("sites").select(["id", "code", "name"]).orderBy("code").execute();
}

export async function findSiteIdByCode(trx: Db | Trx, code: string): Promise<string | undefined> {
  return (await trx.selectFrom("sites").select("id").where("code", "=", code).executeTakeFirst())?.id;
}

function columns(input: SiteInput) {
  return {
    code: input.code,
    name: input.name,
    latitude_deg: input.latitudeDeg,
    longitude_deg: input.longitudeDeg,
    height_m: input.heightM,
    time_zone: input.timeZone,
  };
}

export async function insertSite(trx: Trx, input: SiteInput): Promise<string> {
  return (await trx.insertInto("sites").values(columns(input)).returning("id").executeTakeFirstOrThrow()).id;
}

/** Locks the row for the rest of the transaction; undefined when it is gone. */
export async function lockSite(trx: Trx, id: string): Promise<Site | undefined> {
  const row = await sitesQuery(trx).where("s.id", "=", id).forUpdate("s").executeTakeFirst();
  return row && toSite(row);
}

export async function updateSiteById(trx: Trx, id: string, input: SiteInput): Promise<void> {
  await trx.updateTable("sites").set(columns(input)).where("id", "=", id).execute();
}

export async function deleteSiteById(trx: Trx, id: string): Promise<void> {
  await trx.deleteFrom("sites").where("id", "=", id).execute();
}
