import type { ExecutionOutcome } from "@/db/types";
import type { BlockState } from "./types";

/**
 * A block's state for the night assistant. A logged outcome wins over the clock: a block
 * aborted at 02:00 is aborted even if its slot runs to 04:00. Without a log, the clock
 * decides; intervals are half-open like the schedule's.
 */
export function blockState(block: { startsAt: Date; endsAt: Date }, now: Date, outcome: ExecutionOutcome | null): BlockState {
  if (outcome === "executed" || outcome === "partial") return "done";
  if (outcome) return "aborted";
  if (now < block.startsAt) return "upcoming";
  if (now < block.endsAt) return "on_sky";
  return "done";
}
