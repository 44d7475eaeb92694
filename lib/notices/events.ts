/**
 * The eight notice events and the facts each one carries. A payload is what the e-mail
 * and the in-app notice are written from, so it holds names and numbers, not ids to look
 * up later: the worker renders exactly what was true when the change was committed.
 * Instants are Dates in code and ISO strings inside a queued job (`z.coerce.date()`
 * reads them back). Durations are minutes, ledger balances hours.
 */
import { z } from "zod";
import { AWAITING_DECISION_STATES, EXECUTION_OUTCOMES, NOTICE_EVENTS, type NoticeEvent, type Role } from "@/db/types";

export { NOTICE_EVENTS, type NoticeEvent };

const instant = z.coerce.date();
const text = (max: number) => z.string().trim().min(1).max(max);

export const siteRefSchema = z.object({ code: text(40), name: text(200), timeZone: text(80) });
export const telescopeRefSchema = z.object({ code: text(40), name: text(200) });
export const personRefSchema = z.object({ name: text(200), email: z.string().max(320) });
export const intervalSchema = z.object({ startsAt: instant, endsAt: instant });

export type SiteRef = z.infer<typeof siteRefSchema>;
export type TelescopeRef = z.infer<typeof telescopeRefSchema>;
export type PersonRef = z.infer<typeof personRefSchema>;
export type Interval = z.infer<typeof intervalSchema>;

export const URGENCIES = ["now", "tonight", "within_days"] as const;
export type Urgency = (typeof URGENCIES)[number];

/** To every active director: a ToO request is waiting in the review queue. */
export const requestSubmittedSchema = z.object({
  requestId: z.uuid(),
  targetName: text(200),
  programCode: text(40),
  programTitle: text(300),
  piName: text(200),
  urgency: z.enum(URGENCIES),
  /** Only for `within_days`: the request lapses after this instant. */
  deadline: instant.nullable(),
  submittedAt: instant,
  requestedMinutes: z.number().int().positive(),
  telescopes: z.array(telescopeRefSchema).min(1),
  /** The site whose local time the e-mail shows beside UT (the first acceptable telescope's). */
  site: siteRefSchema,
  /** The first observable window found by the feasibility check, when there is one. */
  firstWindow: intervalSchema.nullable(),
  justification: z.string().max(600),
});

/** To the PI: the director approved or declined the request, and why. */
export const decisionMadeSchema = z.object({
  requestId: z.uuid(),
  piUserId: z.uuid(),
  targetName: text(200),
  programCode: text(40),
  decision: z.enum(["approved", "declined"]),
  reason: text(2000),
  decidedBy: personRefSchema,
  decidedAt: instant,
  /** The granted slot's site, or the first acceptable telescope's when declined: local times are shown there. */
  site: siteRefSchema,
  /** The slot granted on approval; null when declined. */
  slot: z.object({ telescope: telescopeRefSchema, startsAt: instant, endsAt: instant }).nullable(),
  /** Scheduled minutes the override displaces (0 when it used free or engineering time). */
  displacedMinutes: z.number().int().nonnegative(),
});

/** To each displaced observer: what they lose, by how much, what they are owed, who to ask. */
export const blockDisplacedSchema = z.object({
  displacementId: z.uuid(),
  observerUserId: z.uuid(),
  requestId: z.uuid(),
  targetName: text(200),
  programCode: text(40),
  programTitle: text(300),
  telescope: telescopeRefSchema,
  site: siteRefSchema,
  /** The block as it was scheduled. */
  block: intervalSchema,
  /** The parts of it given to the override. */
  lost: z.array(intervalSchema).min(1),
  lostMinutes: z.number().int().positive(),
  /** What is left of the block (empty when the whole block went). */
  remaining: z.array(intervalSchema),
  /** Hours credited to the program on the time-owed ledger for this displacement. */
  owedHours: z.number().nonnegative(),
  contact: personRefSchema,
});

export const TONIGHT_CHANGE_KINDS = ["added", "shortened", "split", "removed"] as const;
export type TonightChangeKind = (typeof TONIGHT_CHANGE_KINDS)[number];

/** To the night assistants of one telescope: tonight's queue changed. */
export const tonightChangedSchema = z.object({
  changeId: z.uuid(),
  telescopeId: z.uuid(),
  telescope: telescopeRefSchema,
  site: siteRefSchema,
  /** The local date on which the night begins (YYYY-MM-DD). */
  nightOf: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  targetName: z.string().max(200).nullable(),
  changes: z
    .array(
      z.object({
        kind: z.enum(TONIGHT_CHANGE_KINDS),
        programCode: text(40),
        /** A short description: the target of a ToO block, the observer of a science block. */
        label: z.string().max(200),
        startsAt: instant,
        endsAt: instant,
      }),
    )
    .min(1),
});

/** To the observer: a payback block repays time the program was owed. */
export const paybackScheduledSchema = z.object({
  paybackBlockId: z.uuid(),
  observerUserId: z.uuid(),
  programCode: text(40),
  programTitle: text(300),
  telescope: telescopeRefSchema,
  site: siteRefSchema,
  startsAt: instant,
  endsAt: instant,
  minutes: z.number().int().positive(),
  owedBeforeHours: z.number().nonnegative(),
  owedAfterHours: z.number().nonnegative(),
  contact: personRefSchema,
});

/** What a logged outcome can make of a ToO request. */
export const SETTLED_REQUEST_STATES = ["executed", "partially_executed", "not_executed"] as const;
export type SettledRequestState = (typeof SETTLED_REQUEST_STATES)[number];

/** To the PI: the night assistant logged what happened to their ToO block, which settled the request. */
export const outcomeLoggedSchema = z.object({
  /** The night-log entry; a later log of the same block (a correction) is a new notice. */
  executionId: z.uuid(),
  requestId: z.uuid(),
  piUserId: z.uuid(),
  targetName: text(200),
  programCode: text(40),
  telescope: telescopeRefSchema,
  site: siteRefSchema,
  /** The ToO block as it was scheduled. */
  block: intervalSchema,
  outcome: z.enum(EXECUTION_OUTCOMES),
  /** Minutes actually observed, when the night assistant said. */
  minutesUsed: z.number().int().nonnegative().nullable(),
  /** The night assistant's note (may be empty). */
  note: z.string().max(4000),
  requestState: z.enum(SETTLED_REQUEST_STATES),
  loggedBy: personRefSchema,
  loggedAt: instant,
});

/** To the PI: the request's deadline passed before a director decided, so it lapsed and will not be scheduled. */
export const requestLapsedSchema = z.object({
  requestId: z.uuid(),
  piUserId: z.uuid(),
  targetName: text(200),
  programCode: text(40),
  urgency: z.enum(URGENCIES),
  /** Where it was waiting: `submitted` means no director had opened it yet. */
  fromState: z.enum(AWAITING_DECISION_STATES),
  submittedAt: instant,
  deadline: instant,
  /** When the lapse was recorded (at most about a minute after the deadline). */
  lapsedAt: instant,
  requestedMinutes: z.number().int().positive(),
  /** The acceptable telescopes (empty only for a request filed without any, which the form never allows). */
  telescopes: z.array(telescopeRefSchema),
  /** The first acceptable telescope's site, whose local time the e-mail shows beside UT. */
  site: siteRefSchema,
});

/** To the PI: the director returned the request as a draft, saying what to change before it is filed again. */
export const requestReturnedSchema = z.object({
  /** The return decision: a request returned again after it was refiled is a new notice. */
  returnId: z.uuid(),
  requestId: z.uuid(),
  piUserId: z.uuid(),
  targetName: text(200),
  programCode: text(40),
  /** What the PI should change, in the director's words. */
  note: text(4000),
  returnedBy: personRefSchema,
  returnedAt: instant,
  /** Only for `within_days`: the request's deadline, which still stands. */
  deadline: instant.nullable(),
  /** The first acceptable telescope's site, whose local time is shown beside UT. */
  site: siteRefSchema,
});

export const NOTICE_PAYLOAD_SCHEMAS = {
  request_submitted: requestSubmittedSchema,
  decision_made: decisionMadeSchema,
  block_displaced: blockDisplacedSchema,
  tonight_changed: tonightChangedSchema,
  payback_scheduled: paybackScheduledSchema,
  outcome_logged: outcomeLoggedSchema,
  request_lapsed: requestLapsedSchema,
  request_returned: requestReturnedSchema,
} as const satisfies Record<NoticeEvent, z.ZodType>;

export type RequestSubmittedPayload = z.infer<typeof requestSubmittedSchema>;
export type DecisionMadePayload = z.infer<typeof decisionMadeSchema>;
export type BlockDisplacedPayload = z.infer<typeof blockDisplacedSchema>;
export type TonightChangedPayload = z.infer<typeof tonightChangedSchema>;
export type PaybackScheduledPayload = z.infer<typeof paybackScheduledSchema>;
export type OutcomeLoggedPayload = z.infer<typeof outcomeLoggedSchema>;
export type RequestLapsedPayload = z.infer<typeof requestLapsedSchema>;
export type RequestReturnedPayload = z.infer<typeof requestReturnedSchema>;

export interface NoticePayloads {
  request_submitted: RequestSubmittedPayload;
  decision_made: DecisionMadePayload;
  block_displaced: BlockDisplacedPayload;
  tonight_changed: TonightChangedPayload;
  payback_scheduled: PaybackScheduledPayload;
  outcome_logged: OutcomeLoggedPayload;
  request_lapsed: RequestLapsedPayload;
  request_returned: RequestReturnedPayload;
}

/** One event with its payload, discriminated by `event`. */
export type NoticeOf<E extends NoticeEvent = NoticeEvent> = { [K in E]: { event: K; payload: NoticePayloads[K] } }[E];

/** What each event is called on the preferences form, and which roles receive it. */
export const NOTICE_EVENT_LABELS: Record<NoticeEvent, { label: string; roles: readonly Role[] }> = {
  request_submitted: { label: "A ToO request is submitted", roles: ["director"] },
  decision_made: { label: "A decision on my ToO request", roles: ["pi"] },
  block_displaced: { label: "My block is displaced by an override", roles: ["observer"] },
  tonight_changed: { label: "Tonight's queue changes on my telescope", roles: ["night_assistant"] },
  payback_scheduled: { label: "A payback block is scheduled for me", roles: ["observer"] },
  outcome_logged: { label: "The night log records what happened to my ToO", roles: ["pi"] },
  request_lapsed: { label: "My ToO request lapsed at its deadline without a decision", roles: ["pi"] },
  request_returned: { label: "My ToO request is returned to me for changes", roles: ["pi"] },
};

/** Parses a payload (from a queued job, say) back into its typed form with Dates. */
export function parseNotice(event: NoticeEvent, payload: unknown): NoticeOf {
  switch (event) {
    case "request_submitted":
      return { event, payload: requestSubmittedSchema.parse(payload) };
    case "decision_made":
      return { event, payload: decisionMadeSchema.parse(payload) };
    case "block_displaced":
      return { event, payload: blockDisplacedSchema.parse(payload) };
    case "tonight_changed":
      return { event, payload: tonightChangedSchema.parse(payload) };
    case "payback_scheduled":
      return { event, payload: paybackScheduledSchema.parse(payload) };
    case "outcome_logged":
      return { event, payload: outcomeLoggedSchema.parse(payload) };
    case "request_lapsed":
      return { event, payload: requestLapsedSchema.parse(payload) };
    case "request_returned":
      return { event, payload: requestReturnedSchema.parse(payload) };
  }
}
