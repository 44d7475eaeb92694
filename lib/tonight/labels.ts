import type { ExecutionOutcome, RequestState, ScheduleChangeKind } from "@/db/types";
import type { BlockState, OnSkyLimit } from "./types";

export const BLOCK_STATE_LABELS: Record<BlockState, string> = {
  upcoming: "Upcoming",
  on_sky: "On sky",
  done: "Done",
  aborted: "Aborted",
};

export const OUTCOME_LABELS: Record<ExecutionOutcome, string> = {
  executed: "Executed",
  partial: "Partial",
  aborted: "Aborted",
  weather: "Lost to weather",
  technical: "Lost to technical fault",
};

export const CHANGE_KIND_LABELS: Record<ScheduleChangeKind, string> = {
  override: "Override added",
  displaced: "Block displaced",
  moved: "Block moved",
  payback: "Payback block added",
  removed: "Block removed",
};

export const LIMIT_LABELS: Record<OnSkyLimit, string> = {
  airmass: "airmass limit",
  altitude: "altitude limit",
  dawn: "dawn",
  ephemeris_end: "end of the ephemeris",
};

/** What a logged outcome makes of the ToO request behind the block. */
export const SETTLED_STATE = {
  executed: "executed",
  partial: "partially_executed",
  aborted: "not_executed",
  weather: "not_executed",
  technical: "not_executed",
} as const satisfies Record<ExecutionOutcome, RequestState>;
