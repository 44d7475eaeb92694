/**
 * The impact of a slot, as a pure function: which blocks an override on [start, end)
 * would cut into, how (the splice's own plan, so the preview and the approval agree),
 * the minutes displaced per program and per observer, and what each would be owed under
 * the consortium's credit ratio. Instants are epoch milliseconds; durations minutes.
 *
 * An override never displaces another override: a slot touching a ToO block is reported
 * as blocked, with the block in the way, and nothing is planned for it.
 */
import type { BlockKind } from "@/db/types";
import { planSplice, type BlockChange } from "@/lib/splice/plan";

export interface ImpactBlock {
  id: string;
  start: number;
  end: number;
  kind: BlockKind;
  programId: string;
  programCode: string;
  programTitle: string;
  programRank: number;
  observerUserId: string | null;
  observerName: string | null;
  observerEmail: string | null;
}

/** Whose block it is: everything of an ImpactBlock but its id and times. */
export type BlockOwner = Omit<ImpactBlock, "id" | "start" | "end">;

export interface DisplacedBlock extends BlockOwner {
  blockId: string;
  blockStart: number;
  blockEnd: number;
  lostStart: number;
  lostEnd: number;
  change: BlockChange["type"];
  minutes: number;
  owedMinutes: number;
}

export interface ProgramImpact {
  programId: string;
  programCode: string;
  programTitle: string;
  programRank: number;
  minutes: number;
  owedMinutes: number;
}

export interface ObserverImpact {
  observerUserId: string | null;
  observerName: string | null;
  observerEmail: string | null;
  minutes: number;
  owedMinutes: number;
}

export interface SlotImpact {
  start: number;
  end: number;
  slotMinutes: number;
  creditRatio: number;
  blocks: DisplacedBlock[];
  byProgram: ProgramImpact[];
  byObserver: ObserverImpact[];
  displacedMinutes: number;
  owedMinutes: number;
  /** ToO blocks in the slot: an approval there would be refused. */
  blockedBy: Array<{ blockId: string; programCode: string; start: number; end: number }>;
}

const byMinutesThenCode = <T extends { minutes: number }>(key: (x: T) => string) => (a: T, b: T) => b.minutes - a.minutes || key(a).localeCompare(key(b));

export function computeImpact(slot: { start: number; end: number }, blocks: readonly ImpactBlock[], creditRatio: number): SlotImpact {
  const overlapping = blocks.filter((b) => b.start < slot.end && b.end > slot.start);
  const blockedBy = overlapping.filter((b) => b.kind === "too").map((b) => ({ blockId: b.id, programCode: b.programCode, start: b.start, end: b.end }));
  const byId = new Map(overlapping.map((b) => [b.id, b]));
  const plan = planSplice(slot, blockedBy.length ? [] : overlapping);
  const change = new Map(plan.changes.map((c) => [c.block.id, c.type]));

  const displaced: DisplacedBlock[] = [];
  for (const d of plan.displacements) {
    const b = byId.get(d.blockId);
    if (!b) continue;
    const { id, start, end, ...owner } = b;
    displaced.push({
      ...owner,
      blockId: id,
      blockStart: start,
      blockEnd: end,
      lostStart: d.start,
      lostEnd: d.end,
      change: change.get(b.id) ?? "remove",
      minutes: d.minutes,
      owedMinutes: d.minutes * creditRatio,
    });
  }

  const programs = new Map<string, ProgramImpact>();
  const observers = new Map<string, ObserverImpact>();
  for (const d of displaced) {
    const p = programs.get(d.programId) ?? { programId: d.programId, programCode: d.programCode, programTitle: d.programTitle, programRank: d.programRank, minutes: 0, owedMinutes: 0 };
    p.minutes += d.minutes;
    p.owedMinutes += d.owedMinutes;
    programs.set(d.programId, p);
    // Blocks without an observer are gathered under one "no observer" line.
    const key = d.observerUserId ?? "";
    const o = observers.get(key) ?? { observerUserId: d.observerUserId, observerName: d.observerName, observerEmail: d.observerEmail, minutes: 0, owedMinutes: 0 };
    o.minutes += d.minutes;
    o.owedMinutes += d.owedMinutes;
    observers.set(key, o);
  }

  return {
    start: slot.start,
    end: slot.end,
    slotMinutes: (slot.end - slot.start) / 60_000,
    creditRatio,
    blocks: displaced,
    byProgram: [...programs.values()].sort(byMinutesThenCode((p) => p.programCode)),
    byObserver: [...observers.values()].sort(byMinutesThenCode((o) => o.observerName ?? "")),
    displacedMinutes: plan.displacedMinutes,
    owedMinutes: plan.displacedMinutes * creditRatio,
    blockedBy,
  };
}
