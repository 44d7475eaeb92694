/** The app's own shape of a ToO request (camelCase, Dates), as lib/requests/queries.ts returns it. */
import type { DarknessLevel, RequestState, RequestUrgency, StoredEphemerisRow, TargetKind } from "@/db/types";
import type { FeasibilitySnapshot } from "./feasibility/types";

export interface RequestTelescopeRef {
  id: string;
  code: string;
  name: string;
}

export interface TooRequest {
  id: string;
  piUserId: string;
  piName: string;
  programId: string | null;
  programCode: string | null;
  programTitle: string | null;
  source: "form" | "api";
  state: RequestState;
  targetName: string;
  target: {
    kind: TargetKind;
    /** What the PI typed, kept so a draft shows it back even before it parses. */
    raText: string;
    decText: string;
    raDeg: number | null;
    decDeg: number | null;
    ephemeris: StoredEphemerisRow[] | null;
    hMag: number | null;
    gSlope: number | null;
  };
  telescopes: RequestTelescopeRef[];
  instrumentId: string | null;
  instrumentCode: string | null;
  durationMinutes: number | null;
  earliestStart: Date | null;
  latestEnd: Date | null;
  deadline: Date | null;
  urgency: RequestUrgency | null;
  constraints: {
    maxAirmass: number | null;
    darkness: DarknessLevel;
    minMoonSeparationDeg: number | null;
    maxMoonIllumination: number | null;
  };
  justification: string;
  feasibility: FeasibilitySnapshot | null;
  directorNote: string | null;
  createdAt: Date;
  updatedAt: Date;
  submittedAt: Date | null;
}

export interface RequestListItem {
  id: string;
  state: RequestState;
  targetName: string;
  programCode: string | null;
  urgency: RequestUrgency | null;
  telescopeCodes: string[];
  deadline: Date | null;
  createdAt: Date;
  updatedAt: Date;
  submittedAt: Date | null;
}

export interface RequestEvent {
  id: string;
  at: Date;
  actorName: string | null;
  fromState: RequestState | null;
  toState: RequestState;
  note: string;
}
