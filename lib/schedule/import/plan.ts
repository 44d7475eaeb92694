import type { Db, Trx } from "@/db/index";
import { planRows } from "./plan-rows";
import { listExistingBlocks, loadImportCatalog } from "./queries";
import { parseImportTime } from "./times";
import type { ImportPlan, ImportRow } from "./types";

/** The instants the rows span, for fetching only the existing blocks that could collide. */
function span(rows: ImportRow[]): { from: Date; to: Date } | null {
  let from = Infinity;
  let to = -Infinity;
  for (const row of rows) {
    for (const raw of [row.start, row.end]) {
      const t = parseImportTime(raw, row.timeZone);
      if (t.ok) {
        from = Math.min(from, t.instant.getTime());
        to = Math.max(to, t.instant.getTime());
      }
    }
  }
  return from <= to ? { from: new Date(from), to: new Date(to) } : null;
}

/**
 * The dry run: resolve codes, read times, find overlaps with existing blocks and between
 * the rows themselves. Writes nothing. Pass a transaction to plan against what it sees.
 */
export async function planImport(db: Db | Trx, rows: ImportRow[]): Promise<ImportPlan> {
  const catalog = await loadImportCatalog(db, rows);
  const range = span(rows);
  const telescopeIds = [...catalog.telescopes.values()].map((t) => t.id);
  const existing = range ? await listExistingBlocks(db, telescopeIds, range.from, range.to) : [];
  return planRows(rows, catalog, existing);
}
