/**
 * The director's routes: the decision on a request, the impact of a slot, the ledger.
 * Wired into the document by one line in lib/openapi/document.ts's PATH_GROUPS.
 */
import type { OpenAPIRegistry } from "@asteasolutions/zod-to-openapi";
import { z } from "zod";
import { ledgerQuerySchema } from "@/lib/ledger/schemas";
import { impactQuerySchema } from "@/lib/impact/schemas";
import { decisionSchema } from "@/lib/review/schemas";
import { BEARER, errorSchema, errors, json, jsonBody, uuidParams } from "../common";

const instant = z.string().meta({ format: "date-time" });
const blockKind = z.enum(["science", "engineering", "discretionary", "too", "payback"]);

const impactSchema = z
  .object({
    telescope: z.object({ id: z.string(), code: z.string(), name: z.string(), timeZone: z.string() }),
    start: instant,
    end: instant,
    slotMinutes: z.number(),
    creditRatio: z.number().meta({ description: "Minutes credited per minute displaced (the consortium's policy)." }),
    displacedMinutes: z.number(),
    owedMinutes: z.number(),
    approvable: z.boolean().meta({ description: "False when another override holds part of the slot (see blockedBy)." }),
    blockedBy: z.array(z.object({ blockId: z.string(), programCode: z.string(), start: instant, end: instant })),
    blocks: z.array(
      z.object({
        blockId: z.string(),
        kind: blockKind,
        programId: z.string(),
        programCode: z.string(),
        programTitle: z.string(),
        programRank: z.number(),
        observerUserId: z.string().nullable(),
        observerName: z.string().nullable(),
        observerEmail: z.string().nullable(),
        blockStart: instant,
        blockEnd: instant,
        lostStart: instant,
        lostEnd: instant,
        change: z.enum(["remove", "trim-end", "trim-start", "split"]),
        minutes: z.number(),
        owedMinutes: z.number(),
      }),
    ),
    byProgram: z.array(z.object({ programId: z.string(), programCode: z.string(), programTitle: z.string(), programRank: z.number(), minutes: z.number(), owedMinutes: z.number() })),
    byObserver: z.array(z.object({ observerUserId: z.string().nullable(), observerName: z.string().nullable(), observerEmail: z.string().nullable(), minutes: z.number(), owedMinutes: z.number() })),
  })
  .meta({ id: "SlotImpact" });

const balance = { chargedMinutes: z.number(), creditedMinutes: z.number(), repaidMinutes: z.number(), owedMinutes: z.number() };
const ledgerSchema = z
  .object({
    scope: z.enum(["all", "mine"]),
    creditRatio: z.number(),
    programs: z.array(
      z.object({ semesterId: z.string(), semesterCode: z.string(), partnerId: z.string(), partnerCode: z.string(), partnerName: z.string(), programId: z.string(), programCode: z.string(), programTitle: z.string(), ...balance }),
    ),
    partners: z.array(z.object({ partnerId: z.string(), partnerCode: z.string(), partnerName: z.string(), semesterId: z.string(), semesterCode: z.string(), ...balance })),
    semesters: z.array(z.object({ semesterId: z.string(), semesterCode: z.string(), ...balance })),
    totals: z.object(balance),
  })
  .meta({ id: "Ledger" });

const decisionAnswer = z
  .object({
    requestId: z.string(),
    decision: z.enum(["approve", "decline", "return"]),
    state: z.enum(["approved", "declined", "draft"]),
    alreadyApproved: z.boolean().optional(),
    tooBlockId: z.string().nullable().optional(),
    displacedMinutes: z.number().optional(),
  })
  .meta({ id: "DecisionOutcome" });

export function registerDecisionLedgerPaths(registry: OpenAPIRegistry): void {
  registry.registerPath({
    method: "post",
    path: "/api/v1/too-requests/{id}/decision",
    tags: ["Decisions"],
    summary: "Decide a request",
    description:
      "Approve a slot (the schedule is spliced in one transaction: displaced blocks are trimmed, split or removed, the ledger is booked and everyone affected is told), " +
      "decline with a reason, or return the request to the PI with a note. Approving the same slot again is harmless. " +
      "If another override took part of the slot a moment ago the answer is 409 `slot_taken` with the slot's fresh impact. " +
      "A request whose deadline has passed cannot be approved (409 `conflict`; it lapses instead). Role: director.",
    security: BEARER,
    request: { params: uuidParams, body: jsonBody(decisionSchema.meta({ id: "DecisionInput" })) },
    responses: {
      200: json(decisionAnswer, "Decided."),
      409: json(
        errorSchema.extend({ impact: impactSchema.nullable() }),
        "The request is no longer open (decided, withdrawn or lapsed), its deadline has passed, or the slot was taken (`slot_taken`, with the fresh impact).",
      ),
      ...errors(400, 403, 404),
    },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/impact",
    tags: ["Decisions"],
    summary: "Impact of a slot",
    description: "Every scheduled block an override in the slot would cut into, the displaced minutes per program and observer, and what each would be owed. Read-only. Roles: director, admin.",
    security: BEARER,
    request: { query: impactQuerySchema },
    responses: { 200: json(z.object({ impact: impactSchema }), "The impact."), ...errors(400, 403, 404) },
  });
  registry.registerPath({
    method: "get",
    path: "/api/v1/ledger",
    tags: ["Ledger"],
    summary: "Time-owed balances",
    description:
      "Per program, partner and semester: minutes charged to ToO programs, credited to displaced programs, repaid by payback blocks, and still owed. " +
      "Directors and admins see every program, PIs and observers their own. `format=csv` answers a CSV file. Roles: director, admin, pi, observer.",
    security: BEARER,
    request: { query: ledgerQuerySchema },
    responses: {
      200: { description: "The balances (JSON), or CSV with `format=csv`.", content: { "application/json": { schema: ledgerSchema }, "text/csv": { schema: z.string() } } },
      ...errors(400, 403),
    },
  });
}
