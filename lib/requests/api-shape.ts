/**
 * A request as the machine API answers it. The zod schema documents the shape in the
 * OpenAPI document, and toApiRequest is typed by it, so the two cannot drift apart.
 */
import { z } from "zod";
import { ATTACHMENT_KINDS, DARKNESS_LEVELS, REQUEST_STATES, REQUEST_URGENCIES, TARGET_KINDS } from "@/db/types";
import type { Attachment } from "@/lib/attachments/queries";
import { formatDec, formatRa } from "@/lib/sky";
import type { RequestEvent, TooRequest } from "./types";
import { feasibilityHorizonSchema } from "./feasibility/types";

const instant = z.string().meta({ format: "date-time", example: "2026-12-02T03:30:00.000Z" });
const windowSchema = z.object({ start: instant, end: instant, durationMinutes: z.number(), bestAirmass: z.number().nullable() });

export const apiRequestSchema = z
  .object({
    id: z.uuid(),
    state: z.enum(REQUEST_STATES).meta({
      description:
        "draft → submitted → in_review → approved | declined | withdrawn | lapsed; approved → executed | partially_executed | not_executed. " +
        "A request still submitted or in review when its deadline passes becomes `lapsed` (within about a minute; the PI is notified) and can no longer be approved. Drafts never lapse.",
    }),
    source: z.enum(["form", "api"]),
    programId: z.uuid().nullable(),
    programCode: z.string().nullable(),
    piName: z.string(),
    targetName: z.string(),
    target: z.object({
      kind: z.enum(TARGET_KINDS),
      ra: z.string().nullable().meta({ description: "Right ascension, ICRS, hours:minutes:seconds." }),
      dec: z.string().nullable().meta({ description: "Declination, ICRS, degrees:arcminutes:arcseconds." }),
      raDeg: z.number().nullable(),
      decDeg: z.number().nullable(),
      ephemeris: z
        .array(
          z.object({
            time: instant,
            ra: z.number(),
            dec: z.number(),
            rAu: z.number().optional(),
            deltaAu: z.number().optional(),
            magnitude: z.number().optional(),
          }),
        )
        .nullable(),
      hMag: z.number().nullable(),
      gSlope: z.number().nullable(),
    }),
    telescopes: z.array(z.object({ id: z.uuid(), code: z.string(), name: z.string() })),
    instrumentId: z.uuid().nullable(),
    instrumentCode: z.string().nullable(),
    durationMinutes: z.number().int().nullable(),
    earliestStart: instant.nullable(),
    latestEnd: instant.nullable(),
    deadline: instant.nullable().meta({ description: "When the result stops being useful: an undecided request lapses after it." }),
    urgency: z.enum(REQUEST_URGENCIES).nullable(),
    constraints: z.object({
      maxAirmass: z.number().nullable(),
      darkness: z.enum(DARKNESS_LEVELS),
      minMoonSeparationDeg: z.number().nullable(),
      maxMoonIllumination: z.number().nullable(),
    }),
    justification: z.string(),
    directorNote: z.string().nullable(),
    createdAt: instant,
    updatedAt: instant,
    submittedAt: instant.nullable(),
    feasibility: z
      .object({
        verdict: z.enum(["feasible", "refused"]),
        computedAt: instant,
        horizon: feasibilityHorizonSchema,
        reasons: z.array(z.string()),
        telescopes: z.array(
          z.object({
            telescopeId: z.uuid(),
            code: z.string(),
            verdict: z.enum(["feasible", "no_window", "sun_refused"]),
            reason: z.string(),
            longestWindowMinutes: z.number(),
            firstSlot: windowSchema.nullable(),
          }),
        ),
        disclaimer: z.string(),
      })
      .nullable()
      .meta({ description: "The feasibility check made when the request was filed (a planning aid)." }),
    history: z.array(
      z.object({ at: instant, actor: z.string().nullable(), from: z.enum(REQUEST_STATES).nullable(), to: z.enum(REQUEST_STATES), note: z.string() }),
    ),
    attachments: z.array(
      z.object({ id: z.uuid(), kind: z.enum(ATTACHMENT_KINDS), fileName: z.string(), contentType: z.string(), sizeBytes: z.number().int(), url: z.string(), createdAt: instant }),
    ),
  })
  .meta({ id: "TooRequest" });

export type ApiRequest = z.infer<typeof apiRequestSchema>;

const iso = (d: Date | null) => (d === null ? null : d.toISOString());

export function toApiRequest(r: TooRequest, history: RequestEvent[], attachments: Attachment[]): ApiRequest {
  const f = r.feasibility;
  return {
    id: r.id,
    state: r.state,
    source: r.source,
    programId: r.programId,
    programCode: r.programCode,
    piName: r.piName,
    targetName: r.targetName,
    target: {
      kind: r.target.kind,
      ra: r.target.raDeg === null ? null : formatRa(r.target.raDeg),
      dec: r.target.decDeg === null ? null : formatDec(r.target.decDeg),
      raDeg: r.target.raDeg,
      decDeg: r.target.decDeg,
      ephemeris: r.target.ephemeris,
      hMag: r.target.hMag,
      gSlope: r.target.gSlope,
    },
    telescopes: r.telescopes,
    instrumentId: r.instrumentId,
    instrumentCode: r.instrumentCode,
    durationMinutes: r.durationMinutes,
    earliestStart: iso(r.earliestStart),
    latestEnd: iso(r.latestEnd),
    deadline: iso(r.deadline),
    urgency: r.urgency,
    constraints: r.constraints,
    justification: r.justification,
    directorNote: r.directorNote,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
    submittedAt: iso(r.submittedAt),
    feasibility: f && {
      verdict: f.verdict,
      computedAt: f.computedAt,
      horizon: f.horizon,
      reasons: f.reasons,
      telescopes: f.telescopes.map((t) => ({
        telescopeId: t.telescopeId,
        code: t.code,
        verdict: t.verdict,
        reason: t.reason,
        longestWindowMinutes: t.longestWindowMinutes,
        firstSlot: t.firstSlot,
      })),
      disclaimer: f.disclaimer,
    },
    history: history.map((e) => ({ at: e.at.toISOString(), actor: e.actorName, from: e.fromState, to: e.toState, note: e.note })),
    attachments: attachments.map((a) => ({
      id: a.id,
      kind: a.kind,
      fileName: a.fileName,
      contentType: a.contentType,
      sizeBytes: a.sizeBytes,
      url: a.url,
      createdAt: a.createdAt.toISOString(),
    })),
  };
}
