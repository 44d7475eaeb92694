/**
 * Tonight's queue as the page and the API see it. Every instant is an ISO string (UTC),
 * so the same object goes out as JSON, into a client component's props and into SWR's
 * cache without a reshaping step in between.
 */
import type { AttachmentKind, BlockKind, ExecutionOutcome, RequestState, ScheduleChangeKind, TargetKind } from "@/db/types";
import type { TwilightLevel } from "@/lib/schedule/twilight-bands";

export const BLOCK_STATES = ["upcoming", "on_sky", "done", "aborted"] as const;
export type BlockState = (typeof BLOCK_STATES)[number];

export interface QueueTelescope {
  id: string;
  code: string;
  name: string;
  siteName: string;
  timeZone: string;
  maxAirmass: number;
  minAltitudeDeg: number;
}

export interface QueueNight {
  /** The local date on which the night begins at the site. */
  nightOf: string;
  /** Noon to noon (local mean solar time): every block of the night falls inside. */
  start: string;
  end: string;
  sunset: string | null;
  civilDusk: string | null;
  nauticalDusk: string | null;
  astronomicalDusk: string | null;
  astronomicalDawn: string | null;
  nauticalDawn: string | null;
  civilDawn: string | null;
  sunrise: string | null;
  /** Nested intervals below each twilight level: drawn stacked they darken towards night. */
  bands: Array<{ level: TwilightLevel; start: string; end: string }>;
}

export interface QueueAttachment {
  id: string;
  kind: AttachmentKind;
  fileName: string;
  sizeBytes: number;
  url: string;
}

export interface QueueTarget {
  kind: TargetKind;
  /** ICRS/J2000 degrees; for an ephemeris target, interpolated at the time of the answer (null outside the table). */
  raDeg: number | null;
  decDeg: number | null;
  /** As the PI typed them (empty for ephemeris targets). */
  raText: string;
  decText: string;
  ephemerisRows: number;
}

export interface QueueToo {
  requestId: string;
  requestState: RequestState;
  targetName: string;
  target: QueueTarget;
  justification: string;
  justificationSummary: string;
  attachments: QueueAttachment[];
}

export const ON_SKY_LIMITS = ["airmass", "altitude", "dawn", "ephemeris_end"] as const;
export type OnSkyLimit = (typeof ON_SKY_LIMITS)[number];

export interface OnSkyFigures {
  altitudeDeg: number;
  /** Kasten & Young; null below the horizon. */
  airmass: number | null;
  /** What ends the observation first, when, and in how many whole minutes from now. */
  limit: OnSkyLimit;
  until: string;
  minutesLeft: number;
  /** The target is already past the telescope's airmass or altitude limit. */
  beyondLimitNow: boolean;
}

export interface QueueExecution {
  outcome: ExecutionOutcome;
  minutesUsed: number | null;
  note: string;
  loggedByName: string;
  loggedAt: string;
}

export interface QueueBlock {
  id: string;
  kind: BlockKind;
  startsAt: string;
  endsAt: string;
  state: BlockState;
  programCode: string;
  programTitle: string;
  observerName: string | null;
  instrumentCode: string | null;
  instrumentName: string | null;
  /** An unacknowledged change names this block (or its ToO request). */
  changed: boolean;
  too: QueueToo | null;
  execution: QueueExecution | null;
  onSky: OnSkyFigures | null;
}

export interface QueueChange {
  id: number;
  kind: ScheduleChangeKind;
  at: string;
  startsAt: string;
  endsAt: string;
  summary: string;
  blockId: string | null;
  requestId: string | null;
  targetName: string | null;
}

export interface QueueAcknowledgement {
  userName: string;
  at: string;
  throughChangeId: number;
}

export interface TonightQueue {
  telescope: QueueTelescope;
  night: QueueNight;
  /** The instant the answer was computed: states and on-sky figures refer to it. */
  now: string;
  blocks: QueueBlock[];
  changes: {
    /** Relative to whom: the viewer's own acknowledgements, or (read-only viewers) any night assistant's. */
    basis: "mine" | "telescope";
    /** Not yet acknowledged, oldest first. */
    items: QueueChange[];
    /** More unacknowledged changes exist than are listed. */
    more: number;
    /** Acknowledging the listed items means: through this change id (null when there is nothing). */
    throughChangeId: number | null;
  };
  acknowledgements: {
    mine: QueueAcknowledgement | null;
    recent: QueueAcknowledgement[];
  };
  permissions: { canAcknowledge: boolean; canLog: boolean };
}
