/**
 * Writing blocks. The database's exclusion constraint is what keeps blocks from
 * overlapping; this module turns its refusal into a message that names the block in the way.
 */
import type { Db, Trx } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { formatUt } from "@/lib/time/format";
import { findOverlappingBlocks, type ScheduledBlock } from "./queries";
import type { BlockInput, BlockPatch } from "./schemas";
import { scheduleChanged } from "@/lib/schedule/after-write";

export class BlockConflictError extends Error {
  constructor(readonly conflicting: ScheduledBlock[]) {
    const first = conflicting[0];
    super(
      first
        ? `That time overlaps ${first.program.code} on ${first.telescope.name}, ${formatUt(first.startsAt)}–${formatUt(first.endsAt).slice(11)} UT. Nothing was saved.`
        : "That time overlaps another block on the same telescope. Nothing was saved.",
    );
  }
}

export class BlockNotFoundError extends Error {
  constructor() {
    super("That block no longer exists: it may have been removed by someone else.");
  }
}

export class InstrumentMismatchError extends Error {
  constructor() {
    super("That instrument is not mounted on the chosen telescope.");
  }
}

export function isOverlapViolation(error: unknown): boolean {
  return (error as { code?: string } | null)?.code === "23P01";
}

async function checkInstrument(trx: Trx, telescopeId: string, instrumentId: string | null | undefined) {
  if (!instrumentId) return;
  const row = await trx.selectFrom("instruments").select("id").where("id", "=", instrumentId).where("telescope_id", "=", telescopeId).executeTakeFirst();
  if (!row) throw new InstrumentMismatchError();
}

async function conflictFor(db: Db, telescopeId: string, startsAt: Date, endsAt: Date, exceptId?: string): Promise<BlockConflictError> {
  const blocks = await findOverlappingBlocks(db, telescopeId, startsAt, endsAt, exceptId);
  return new BlockConflictError(blocks);
}

export async function createBlock(db: Db, actorId: string, input: BlockInput): Promise<string> {
  try {
    return await db.transaction().execute(async (trx) => {
      await checkInstrument(trx, input.telescopeId, input.instrumentId);
      const { id } = await trx
        .insertInto("blocks")
        .values({
          telescope_id: input.telescopeId,
          program_id: input.programId,
          observer_user_id: input.observerUserId ?? null,
          instrument_id: input.instrumentId ?? null,
          kind: input.kind,
          starts_at: input.startsAt,
          ends_at: input.endsAt,
          notes: input.notes ?? "",
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await writeAudit(trx, { actorUserId: actorId, action: "block.create", entity: "block", entityId: id, details: { startsAt: input.startsAt, endsAt: input.endsAt } });
      return id;
    });
  } catch (error) {
    if (isOverlapViolation(error)) throw await conflictFor(db, input.telescopeId, input.startsAt, input.endsAt);
    throw error;
  } finally {
    scheduleChanged();
  }
}

export async function updateBlock(db: Db, actorId: string, id: string, patch: BlockPatch): Promise<void> {
  let target: { telescopeId: string; startsAt: Date; endsAt: Date } | undefined;
  try {
    await db.transaction().execute(async (trx) => {
      const before = await trx.selectFrom("blocks").selectAll().where("id", "=", id).forUpdate().executeTakeFirst();
      if (!before) throw new BlockNotFoundError();
      target = {
        telescopeId: patch.telescopeId ?? before.telescope_id,
        startsAt: patch.startsAt ?? before.starts_at,
        endsAt: patch.endsAt ?? before.ends_at,
      };
      if (target.endsAt <= target.startsAt) throw new RangeError("The end must come after the start.");
      await checkInstrument(trx, target.telescopeId, patch.instrumentId === undefined ? before.instrument_id : patch.instrumentId);
      await trx
        .updateTable("blocks")
        .set({
          telescope_id: target.telescopeId,
          program_id: patch.programId ?? before.program_id,
          observer_user_id: patch.observerUserId === undefined ? before.observer_user_id : patch.observerUserId,
          instrument_id: patch.instrumentId === undefined ? before.instrument_id : patch.instrumentId,
          kind: patch.kind ?? before.kind,
          starts_at: target.startsAt,
          ends_at: target.endsAt,
          notes: patch.notes ?? before.notes,
          updated_at: new Date(),
        })
        .where("id", "=", id)
        .execute();
      await writeAudit(trx, {
        actorUserId: actorId,
        action: "block.update",
        entity: "block",
        entityId: id,
        details: { from: { startsAt: before.starts_at, endsAt: before.ends_at, telescopeId: before.telescope_id }, to: target },
      });
    });
  } catch (error) {
    if (isOverlapViolation(error) && target) throw await conflictFor(db, target.telescopeId, target.startsAt, target.endsAt, id);
    throw error;
  } finally {
    scheduleChanged();
  }
}

export async function deleteBlock(db: Db, actorId: string, id: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const row = await trx.deleteFrom("blocks").where("id", "=", id).returningAll().executeTakeFirst();
    if (!row) throw new BlockNotFoundError();
    await writeAudit(trx, {
      actorUserId: actorId,
      action: "block.delete",
      entity: "block",
      entityId: id,
      details: { telescopeId: row.telescope_id, programId: row.program_id, startsAt: row.starts_at, endsAt: row.ends_at, kind: row.kind },
    });
  });
  scheduleChanged();
}
