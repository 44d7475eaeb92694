/**
 * The slot finder's inputs and answers. Instants are epoch milliseconds (UTC), durations
 * minutes. Everything is plain data, so the finder is a pure function of its input.
 */
import type { BlockKind, RequestUrgency } from "@/db/types";
import type { FadeCut } from "@/lib/requests/feasibility/fading";

/** An observable window on one telescope (every sky constraint holds inside it). */
export interface FinderWindow {
  start: number;
  end: number;
  /** When the target is highest in the window, and its airmass then. */
  bestAt: number;
  bestAirmass: number | null;
}

export interface AirmassSample {
  t: number;
  airmass: number | null;
}

export interface FinderBlock {
  id: string;
  start: number;
  end: number;
  kind: BlockKind;
  programId: string;
  programCode: string;
  /** 1 (the committee's highest) to 5. */
  rank: number;
}

export interface FinderTelescope {
  telescopeId: string;
  code: string;
  /** Minutes to break off and set up on a new target. */
  setupMinutes: number;
  windows: FinderWindow[];
  blocks: FinderBlock[];
  /** The target's airmass through the windows; without it a slot is rated by its window's best. */
  airmass?: AirmassSample[];
}

export interface SlotFinderInput {
  now: number;
  durationMinutes: number;
  urgency: RequestUrgency;
  /** The request's usable time: from its earliest start to the earlier of latest end and deadline. */
  horizon: { start: number; end: number };
  /** Where the fading clock ends the usable time early: no slot ends after `fade.at` (a fade at or after `horizon.end` changes nothing). */
  fade?: FadeCut | null;
  telescopes: FinderTelescope[];
  /** The consortium's minimum setup time for an interruption (consortium_settings). */
  interruptSetupMinutes: number;
  /** How many suggestions to return (default 8). */
  limit?: number;
}

export interface DisplacedPart {
  blockId: string;
  programCode: string;
  kind: BlockKind;
  rank: number;
  minutes: number;
}

export interface SlotSuggestion {
  telescopeId: string;
  telescopeCode: string;
  start: number;
  end: number;
  /** Mean airmass over the slot (null when unknown). */
  airmass: number | null;
  displaced: DisplacedPart[];
  displacedMinutes: number;
  /** The block the slot breaks into mid-way, which costs setup time. */
  interrupts: { programCode: string; setupMinutes: number; inProgress: boolean } | null;
  /** Minutes displaced weighted by rank, plus any setup cost. */
  displacementCost: number;
  score: number;
  /** Which criteria this suggestion is the best of the list on. */
  strengths: Array<"earliest" | "airmass" | "displacement">;
  explanation: string;
}

export interface SlotFinderResult {
  suggestions: SlotSuggestion[];
  /** Candidate slots looked at (before ranking and thinning). */
  considered: number;
  /** Why there is nothing to suggest, when there is nothing. */
  reason: string | null;
  /** Why no later slot is offered, when the fading clock cut the usable time short. */
  note: string | null;
}
