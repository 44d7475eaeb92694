/**
 * Committing an import: all or nothing. The plan is made again inside the transaction (the
 * schedule may have changed since the dry run); any problem aborts before a single insert,
 * and the database's no-overlap constraint catches a block written by someone else in
 * between. One audit entry records the whole import.
 */
import type { Db } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { isOverlapViolation } from "@/lib/schedule/service";
import { parseScheduleFile } from "./parse";
import { planImport } from "./plan";
import { insertImportedBlocks } from "./queries";
import { byLine, type ImportFormat, type ImportPlan, type ImportProblem, type ImportRow } from "./types";
import { scheduleChanged } from "@/lib/schedule/after-write";

export class ImportRejectedError extends Error {
  constructor(readonly problems: ImportProblem[]) {
    const n = problems.length;
    super(n ? `Nothing was imported: ${n} problem${n === 1 ? "" : "s"} to fix first.` : "Nothing was imported.");
  }
}

export interface ImportSource {
  fileName: string;
  format: ImportFormat;
}

export interface ImportResult {
  created: number;
  blockIds: string[];
}

export async function commitImport(db: Db, actorId: string, rows: ImportRow[], source?: ImportSource): Promise<ImportResult> {
  if (!rows.length) throw new ImportRejectedError([{ line: 0, reason: "The file holds no blocks to import." }]);
  try {
    return await db.transaction().execute(async (trx) => {
      const plan = await planImport(trx, rows);
      if (plan.problems.length) throw new ImportRejectedError(plan.problems);
      const blockIds = await insertImportedBlocks(trx, plan.toCreate);
      const instants = plan.toCreate.flatMap((b) => [b.startsAt.getTime(), b.endsAt.getTime()]);
      await writeAudit(trx, {
        actorUserId: actorId,
        action: "schedule.import",
        entity: "block",
        entityId: null,
        details: {
          fileName: source?.fileName ?? null,
          format: source?.format ?? rows[0]?.format ?? null,
          created: blockIds.length,
          telescopes: [...new Set(plan.toCreate.map((b) => b.telescope.code))].sort(),
          from: new Date(Math.min(...instants)),
          to: new Date(Math.max(...instants)),
        },
      });
      return { created: blockIds.length, blockIds };
    });
  } catch (error) {
    if (isOverlapViolation(error)) {
      // Someone scheduled a block between our plan and our insert: say which rows now clash.
      const again = await planImport(db, rows);
      throw new ImportRejectedError(
        again.problems.length ? again.problems : [{ line: 0, reason: "Another change to the schedule collided with this import. Check the file again." }],
      );
    }
    throw error;
  } finally {
    scheduleChanged();
  }
}

export interface CheckedFile extends ImportPlan {
  format: ImportFormat;
  rows: ImportRow[];
}

/** Parse and plan: what the "Check file" step shows. Problems from both steps, by line. */
export async function checkImportFile(db: Db, fileName: string, text: string): Promise<CheckedFile> {
  const parsed = parseScheduleFile(fileName, text);
  const plan = parsed.rows.length ? await planImport(db, parsed.rows) : { toCreate: [], problems: [] };
  const problems = [...parsed.problems, ...plan.problems].sort(byLine);
  return { format: parsed.format, rows: parsed.rows, toCreate: plan.toCreate, problems };
}

/** Parse and commit a whole file; a file with any unreadable row is refused as a whole. */
export async function importFile(db: Db, actorId: string, fileName: string, text: string): Promise<ImportResult> {
  const parsed = parseScheduleFile(fileName, text);
  if (parsed.problems.length) throw new ImportRejectedError((await checkImportFile(db, fileName, text)).problems);
  return commitImport(db, actorId, parsed.rows, { fileName, format: parsed.format });
}
