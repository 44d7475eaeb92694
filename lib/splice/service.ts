/**
 * Carries out a splice inside the caller's transaction: locks the blocks the slot
 * touches, trims, splits or removes them, inserts the ToO block, and writes one
 * displacement record per displaced block. Overlaps stay impossible by the database's
 * exclusion constraint: if another approval slipped in, the insert fails with 23P01.
 */
import { sql } from "kysely";
import type { Trx } from "@/db/index";
import { writeAudit } from "@/lib/audit/queries";
import { planSplice, type BlockChange, type SpliceBlock } from "./plan";

export interface SpliceInput {
  telescopeId: string;
  start: Date;
  end: Date;
  requestId: string;
  programId: string;
  instrumentId: string | null;
  observerUserId: string | null;
  notes: string;
  /** Who approved it, and what for: each changed block's history says so. */
  actorUserId: string;
  targetName: string;
}

export interface SplicedDisplacement {
  id: string;
  blockId: string;
  programId: string;
  observerUserId: string | null;
  blockStart: Date;
  blockEnd: Date;
  lostStart: Date;
  lostEnd: Date;
  minutes: number;
  change: BlockChange["type"];
}

export interface SpliceResult {
  tooBlockId: string;
  displacements: SplicedDisplacement[];
  displacedMinutes: number;
}

export class OverrideInTheWayError extends Error {
  constructor() {
    super("The slot overlaps another override: an approved ToO block is never displaced by another.");
  }
}

export async function lockBlocksInSlot(trx: Trx, telescopeId: string, start: Date, end: Date) {
  return trx
    .selectFrom("blocks")
    .selectAll()
    .where("telescope_id", "=", telescopeId)
    .where(sql<boolean>`tstzrange(starts_at, ends_at, '[)') && tstzrange(${start}, ${end}, '[)')`)
    .orderBy("starts_at")
    .forUpdate()
    .execute();
}

export async function spliceOverride(trx: Trx, input: SpliceInput): Promise<SpliceResult> {
  // Splices on one telescope take turns. Without this, a second approval that waited for
  // the first's row locks would not see the remainder block the first one inserted, and
  // would fail on the overlap constraint though its slot was free.
  await trx.selectFrom("telescopes").select("id").where("id", "=", input.telescopeId).forNoKeyUpdate().execute();
  const rows = await lockBlocksInSlot(trx, input.telescopeId, input.start, input.end);
  if (rows.some((r) => r.kind === "too")) throw new OverrideInTheWayError();
  const byId = new Map(rows.map((r) => [r.id, r]));
  const blocks: SpliceBlock[] = rows.map((r) => ({
    id: r.id,
    start: r.starts_at.getTime(),
    end: r.ends_at.getTime(),
    programId: r.program_id,
    observerUserId: r.observer_user_id,
  }));
  const plan = planSplice({ start: input.start.getTime(), end: input.end.getTime() }, blocks);

  // The block's history (audit rows) says which override changed it, and who approved it.
  const history = (entityId: string, action: string, details: Record<string, unknown>) =>
    writeAudit(trx, { actorUserId: input.actorUserId, action, entity: "block", entityId, details: { requestId: input.requestId, targetName: input.targetName, ...details } });

  for (const change of plan.changes) {
    const row = byId.get(change.block.id);
    if (!row) continue;
    if (change.type === "remove") {
      await trx.deleteFrom("blocks").where("id", "=", row.id).execute();
      await history(row.id, "block.override_remove", {});
    } else if (change.type === "trim-end") {
      await trx.updateTable("blocks").set({ ends_at: new Date(change.newEnd), updated_at: new Date() }).where("id", "=", row.id).execute();
      await history(row.id, "block.override_trim", { endsAt: new Date(change.newEnd).toISOString() });
    } else if (change.type === "trim-start") {
      await trx.updateTable("blocks").set({ starts_at: new Date(change.newStart), updated_at: new Date() }).where("id", "=", row.id).execute();
      await history(row.id, "block.override_trim", { startsAt: new Date(change.newStart).toISOString() });
    } else {
      await trx.updateTable("blocks").set({ ends_at: new Date(change.firstEnd), updated_at: new Date() }).where("id", "=", row.id).execute();
      await history(row.id, "block.override_split", { endsAt: new Date(change.firstEnd).toISOString() });
      const remainder = await trx
        .insertInto("blocks")
        .values({
          telescope_id: row.telescope_id,
          program_id: row.program_id,
          observer_user_id: row.observer_user_id,
          instrument_id: row.instrument_id,
          kind: row.kind,
          starts_at: new Date(change.secondStart),
          ends_at: row.ends_at,
          notes: row.notes,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await history(remainder.id, "block.override_remainder", { splitFrom: row.id });
    }
  }

  const tooBlock = await trx
    .insertInto("blocks")
    .values({
      telescope_id: input.telescopeId,
      program_id: input.programId,
      observer_user_id: input.observerUserId,
      instrument_id: input.instrumentId,
      kind: "too",
      starts_at: input.start,
      ends_at: input.end,
      notes: input.notes,
      too_request_id: input.requestId,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  await history(tooBlock.id, "block.override_create", {});

  const displacements: SplicedDisplacement[] = [];
  const changeById = new Map(plan.changes.map((c) => [c.block.id, c.type]));
  for (const d of plan.displacements) {
    const row = byId.get(d.blockId);
    if (!row) continue;
    const { id } = await trx
      .insertInto("displacements")
      .values({
        request_id: input.requestId,
        too_block_id: tooBlock.id,
        block_id: d.blockId,
        telescope_id: input.telescopeId,
        program_id: d.programId,
        observer_user_id: d.observerUserId,
        starts_at: new Date(d.start),
        ends_at: new Date(d.end),
        minutes: d.minutes,
        change: changeById.get(d.blockId) ?? "remove",
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    displacements.push({
      id,
      blockId: d.blockId,
      programId: d.programId,
      observerUserId: d.observerUserId,
      blockStart: row.starts_at,
      blockEnd: row.ends_at,
      lostStart: new Date(d.start),
      lostEnd: new Date(d.end),
      minutes: d.minutes,
      change: changeById.get(d.blockId) ?? "remove",
    });
  }
  return { tooBlockId: tooBlock.id, displacements, displacedMinutes: plan.displacedMinutes };
}
