/**
 * The splice, as a pure plan: given an override slot [start, end) on one telescope and
 * the blocks it overlaps, what happens to each block and how many minutes each loses.
 * The database transaction (lib/splice/service.ts) carries the plan out; keeping the
 * geometry here lets it be tested exhaustively without a database.
 *
 * Intervals are half-open, like the database's exclusion constraint: a block that ends
 * exactly when the slot starts is touched, not displaced.
 */

export interface SpliceBlock {
  id: string;
  start: number; // epoch ms
  end: number;
  programId: string;
  observerUserId: string | null;
}

export type BlockChange =
  | { type: "remove"; block: SpliceBlock }
  | { type: "trim-end"; block: SpliceBlock; newEnd: number }
  | { type: "trim-start"; block: SpliceBlock; newStart: number }
  | { type: "split"; block: SpliceBlock; firstEnd: number; secondStart: number };

export interface Displacement {
  blockId: string;
  programId: string;
  observerUserId: string | null;
  start: number;
  end: number;
  minutes: number;
}

export interface SplicePlan {
  changes: BlockChange[];
  displacements: Displacement[];
  displacedMinutes: number;
}

export class InvalidSlotError extends Error {}

const MINUTE = 60_000;

export function planSplice(slot: { start: number; end: number }, blocks: readonly SpliceBlock[]): SplicePlan {
  if (!(slot.end > slot.start)) throw new InvalidSlotError("The slot must end after it starts.");
  const changes: BlockChange[] = [];
  const displacements: Displacement[] = [];
  for (const block of [...blocks].sort((a, b) => a.start - b.start)) {
    const lost = { start: Math.max(block.start, slot.start), end: Math.min(block.end, slot.end) };
    if (lost.end <= lost.start) continue; // touching or apart: nothing displaced
    if (block.start >= slot.start && block.end <= slot.end) changes.push({ type: "remove", block });
    else if (block.start < slot.start && block.end > slot.end) changes.push({ type: "split", block, firstEnd: slot.start, secondStart: slot.end });
    else if (block.start < slot.start) changes.push({ type: "trim-end", block, newEnd: slot.start });
    else changes.push({ type: "trim-start", block, newStart: slot.end });
    displacements.push({
      blockId: block.id,
      programId: block.programId,
      observerUserId: block.observerUserId,
      ...lost,
      minutes: (lost.end - lost.start) / MINUTE,
    });
  }
  return { changes, displacements, displacedMinutes: displacements.reduce((sum, d) => sum + d.minutes, 0) };
}

/** The blocks as they stand after the plan, plus the override itself (for invariant checks and previews). */
export function applyPlan(
  slot: { start: number; end: number },
  blocks: readonly SpliceBlock[],
  plan: SplicePlan,
): Array<{ id: string; start: number; end: number; override?: true }> {
  const changed = new Map(plan.changes.map((c) => [c.block.id, c]));
  const result: Array<{ id: string; start: number; end: number; override?: true }> = [];
  for (const block of blocks) {
    const change = changed.get(block.id);
    if (!change) result.push({ id: block.id, start: block.start, end: block.end });
    else if (change.type === "trim-end") result.push({ id: block.id, start: block.start, end: change.newEnd });
    else if (change.type === "trim-start") result.push({ id: block.id, start: change.newStart, end: block.end });
    else if (change.type === "split") {
      result.push({ id: block.id, start: block.start, end: change.firstEnd });
      result.push({ id: `${block.id}:after`, start: change.secondStart, end: block.end });
    }
  }
  result.push({ id: "override", start: slot.start, end: slot.end, override: true });
  return result.sort((a, b) => a.start - b.start);
}
