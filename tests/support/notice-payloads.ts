/**
 * Realistic, invented notice payloads for the template and delivery tests: a fast-moving
 * object found tonight over the southern site, the override it causes, the block it
 * displaces and the payback that follows. Every name here is invented.
 */
import { randomUUID } from "node:crypto";
import type {
  BlockDisplacedPayload,
  DecisionMadePayload,
  OutcomeLoggedPayload,
  PaybackScheduledPayload,
  RequestLapsedPayload,
  RequestReturnedPayload,
  RequestSubmittedPayload,
  SiteRef,
  TelescopeRef,
  TonightChangedPayload,
} from "@/lib/notices/events";

export const SOUTH: SiteRef = { code: "AQS", name: "Alto Quebrada Station", timeZone: "America/Santiago" };
export const AQ41: TelescopeRef = { code: "AQ41", name: "Quebrada 4.1 m" };
export const AQ16: TelescopeRef = { code: "AQ16", name: "Quebrada 1.6 m" };
export const TARGET = "NBX-7 (Ferrow's fast mover)";
export const DIRECTOR = { name: "Tomasz Okafor-Lind", email: "director@nightbreak.test" };

const at = (iso: string) => new Date(iso);

export function requestSubmitted(over: Partial<RequestSubmittedPayload> = {}): RequestSubmittedPayload {
  return {
    requestId: randomUUID(),
    targetName: TARGET,
    programCode: "CON-TOO-02",
    programTitle: "Rapid characterisation of fast-moving small bodies",
    piName: "Ilona Marsh",
    urgency: "tonight",
    deadline: null,
    submittedAt: at("2026-12-01T21:47:00Z"),
    requestedMinutes: 90,
    telescopes: [AQ41, AQ16],
    site: SOUTH,
    firstWindow: { startsAt: at("2026-12-02T02:10:00Z"), endsAt: at("2026-12-02T05:20:00Z") },
    justification: "Discovered tonight at V≈17.8 and fading by about 0.4 mag per day; colours and a spectrum are needed before it drops below the spectrograph's limit.",
    ...over,
  };
}

export function decisionMade(over: Partial<DecisionMadePayload> = {}): DecisionMadePayload {
  return {
    requestId: randomUUID(),
    piUserId: randomUUID(),
    targetName: TARGET,
    programCode: "CON-TOO-02",
    decision: "approved",
    reason: "Fading fast and well placed after midnight; the displaced engineering time is easy to repay.",
    decidedBy: DIRECTOR,
    decidedAt: at("2026-12-01T22:31:00Z"),
    site: SOUTH,
    slot: { telescope: AQ41, startsAt: at("2026-12-02T02:10:00Z"), endsAt: at("2026-12-02T03:40:00Z") },
    displacedMinutes: 90,
    ...over,
  };
}

export function blockDisplaced(over: Partial<BlockDisplacedPayload> = {}): BlockDisplacedPayload {
  return {
    displacementId: randomUUID(),
    observerUserId: randomUUID(),
    requestId: randomUUID(),
    targetName: TARGET,
    programCode: "AUR-114",
    programTitle: "Cold debris disks around nearby M dwarfs",
    telescope: AQ41,
    site: SOUTH,
    block: { startsAt: at("2026-12-02T01:00:00Z"), endsAt: at("2026-12-02T05:00:00Z") },
    lost: [{ startsAt: at("2026-12-02T02:10:00Z"), endsAt: at("2026-12-02T03:40:00Z") }],
    lostMinutes: 90,
    remaining: [
      { startsAt: at("2026-12-02T01:00:00Z"), endsAt: at("2026-12-02T02:10:00Z") },
      { startsAt: at("2026-12-02T03:40:00Z"), endsAt: at("2026-12-02T05:00:00Z") },
    ],
    owedHours: 1.5,
    contact: DIRECTOR,
    ...over,
  };
}

export function tonightChanged(over: Partial<TonightChangedPayload> = {}): TonightChangedPayload {
  return {
    changeId: randomUUID(),
    telescopeId: randomUUID(),
    telescope: AQ41,
    site: SOUTH,
    nightOf: "2026-12-01",
    targetName: TARGET,
    changes: [
      { kind: "shortened", programCode: "AUR-114", label: "R. Quennell", startsAt: at("2026-12-02T01:00:00Z"), endsAt: at("2026-12-02T02:10:00Z") },
      { kind: "added", programCode: "CON-TOO-02", label: TARGET, startsAt: at("2026-12-02T02:10:00Z"), endsAt: at("2026-12-02T03:40:00Z") },
      { kind: "split", programCode: "AUR-114", label: "R. Quennell", startsAt: at("2026-12-02T03:40:00Z"), endsAt: at("2026-12-02T05:00:00Z") },
    ],
    ...over,
  };
}

export function paybackScheduled(over: Partial<PaybackScheduledPayload> = {}): PaybackScheduledPayload {
  return {
    paybackBlockId: randomUUID(),
    observerUserId: randomUUID(),
    programCode: "AUR-114",
    programTitle: "Cold debris disks around nearby M dwarfs",
    telescope: AQ41,
    site: SOUTH,
    startsAt: at("2027-01-14T03:00:00Z"),
    endsAt: at("2027-01-14T04:30:00Z"),
    minutes: 90,
    owedBeforeHours: 1.5,
    owedAfterHours: 0,
    contact: DIRECTOR,
    ...over,
  };
}

export const NIGHT_ASSISTANT = { name: "Paz Irarrázabal", email: "na.aq41@nightbreak.test" };

export function outcomeLogged(over: Partial<OutcomeLoggedPayload> = {}): OutcomeLoggedPayload {
  return {
    executionId: randomUUID(),
    requestId: randomUUID(),
    piUserId: randomUUID(),
    targetName: TARGET,
    programCode: "CON-TOO-02",
    telescope: AQ41,
    site: SOUTH,
    block: { startsAt: at("2026-12-02T02:10:00Z"), endsAt: at("2026-12-02T03:40:00Z") },
    outcome: "weather",
    minutesUsed: null,
    note: "Dome closed at 01:55 UT: humidity above 90 % and fog from the valley.",
    requestState: "not_executed",
    loggedBy: NIGHT_ASSISTANT,
    loggedAt: at("2026-12-02T04:05:00Z"),
    ...over,
  };
}

export function requestLapsed(over: Partial<RequestLapsedPayload> = {}): RequestLapsedPayload {
  return {
    requestId: randomUUID(),
    piUserId: randomUUID(),
    targetName: TARGET,
    programCode: "CON-TOO-02",
    urgency: "within_days",
    fromState: "in_review",
    submittedAt: at("2026-12-01T21:47:00Z"),
    deadline: at("2026-12-03T12:00:00Z"),
    lapsedAt: at("2026-12-03T12:00:40Z"),
    requestedMinutes: 90,
    telescopes: [AQ41, AQ16],
    site: SOUTH,
    ...over,
  };
}

export function requestReturned(over: Partial<RequestReturnedPayload> = {}): RequestReturnedPayload {
  return {
    returnId: randomUUID(),
    requestId: randomUUID(),
    piUserId: randomUUID(),
    targetName: TARGET,
    programCode: "CON-TOO-02",
    note: "Ask for AQ16 as well: AQ41 is in engineering until 03:00 UT.\nAnd attach the finding chart you mention.",
    returnedBy: DIRECTOR,
    returnedAt: at("2026-12-01T22:31:00Z"),
    deadline: at("2026-12-03T12:00:00Z"),
    site: SOUTH,
    ...over,
  };
}
