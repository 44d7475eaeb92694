import type { Db } from "@/db/index";
import { listInstrumentOptions, listTelescopesForSky, listTooProgramsForPi } from "@/lib/requests/reference-queries";

/** What the request form offers: the PI's ToO programs, every telescope, every instrument. */
export async function loadFormOptions(db: Db, piUserId: string) {
  const [programs, telescopes, instruments] = await Promise.all([listTooProgramsForPi(db, piUserId), listTelescopesForSky(db), listInstrumentOptions(db)]);
  return {
    programs,
    telescopes: telescopes.map((t) => ({ id: t.id, code: t.code, name: t.name, siteName: t.site.name })),
    instruments,
  };
}
