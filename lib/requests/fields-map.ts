/**
 * A request's columns in camelCase, and how a draft (anything typed so far) or a complete
 * request becomes them. A draft keeps each field that parses and drops the rest; the
 * coordinates are kept as typed so the form can show them back.
 */
import type { z } from "zod";
import type { DarknessLevel, RequestUrgency, StoredEphemerisRow, TargetKind } from "@/db/types";
import { DARKNESS_LEVELS, REQUEST_URGENCIES } from "@/db/types";
import { formatDec, formatRa } from "@/lib/sky";
import { idField, numberField, utInstantField } from "@/lib/validation/fields";
import { decField, ephemerisRowSchema, optionalNumberField, raField } from "./fields";
import type { DraftInput, RequestInput } from "./schemas";

export interface RequestFields {
  programId: string | null;
  targetName: string;
  targetKind: TargetKind;
  raText: string;
  decText: string;
  raDeg: number | null;
  decDeg: number | null;
  ephemeris: StoredEphemerisRow[] | null;
  hMag: number | null;
  gSlope: number | null;
  telescopeIds: string[];
  instrumentId: string | null;
  durationMinutes: number | null;
  earliestStart: Date | null;
  latestEnd: Date | null;
  deadline: Date | null;
  urgency: RequestUrgency | null;
  maxAirmass: number | null;
  darkness: DarknessLevel;
  minMoonSeparationDeg: number | null;
  maxMoonIllumination: number | null;
  justification: string;
}

function kept<S extends z.ZodType>(schema: S, value: unknown): Exclude<z.output<S>, undefined> | null {
  if (value === undefined || value === null || value === "") return null;
  const parsed = schema.safeParse(value);
  return parsed.success && parsed.data !== undefined ? (parsed.data as Exclude<z.output<S>, undefined>) : null;
}

const text = (value: unknown, max: number) => (typeof value === "string" ? value.slice(0, max) : typeof value === "number" ? String(value) : "");
const uuid = idField("");
const anyInstant = utInstantField("");

export function draftFields(input: DraftInput): RequestFields {
  const t = input.target ?? {};
  const c = input.constraints ?? {};
  const rows = t.ephemeris?.map((r) => ephemerisRowSchema.safeParse(r));
  const ephemeris = rows && rows.length > 0 && rows.every((r) => r.success) ? rows.map((r) => r.data!) : null;
  return {
    programId: kept(uuid, input.programId),
    targetName: text(input.targetName, 120).trim(),
    targetKind: t.kind ?? "fixed",
    raText: text(t.ra, 100),
    decText: text(t.dec, 100),
    raDeg: kept(raField, t.ra),
    decDeg: kept(decField, t.dec),
    ephemeris,
    hMag: kept(optionalNumberField({ min: -10, max: 40, range: "" }), t.hMag),
    gSlope: kept(optionalNumberField({ min: -0.5, max: 1.5, range: "" }), t.gSlope),
    telescopeIds: [...new Set((input.telescopeIds ?? []).filter((id) => uuid.safeParse(id).success))],
    instrumentId: kept(uuid, input.instrumentId),
    durationMinutes: kept(numberField({ required: "", range: "", min: 1, max: 720, integer: true }), input.durationMinutes),
    earliestStart: kept(anyInstant, input.earliestStart),
    latestEnd: kept(anyInstant, input.latestEnd),
    deadline: kept(anyInstant, input.deadline),
    urgency: REQUEST_URGENCIES.find((u) => u === input.urgency) ?? null,
    maxAirmass: kept(optionalNumberField({ min: 1, max: 5, range: "" }), c.maxAirmass),
    darkness: DARKNESS_LEVELS.find((d) => d === c.darkness) ?? "nautical",
    minMoonSeparationDeg: kept(optionalNumberField({ min: 0, max: 180, range: "" }), c.minMoonSeparationDeg),
    maxMoonIllumination: kept(optionalNumberField({ min: 0, max: 1, range: "" }), c.maxMoonIllumination),
    justification: text(input.justification, 20_000),
  };
}

/** A complete request's columns; `typed` keeps the coordinates as the person wrote them. */
export function filedFields(input: RequestInput, typed: { ra?: unknown; dec?: unknown } = {}): RequestFields {
  const t = input.target;
  const fixed = t.kind === "fixed";
  const raDeg = fixed ? (t.ra ?? null) : null;
  const decDeg = fixed ? (t.dec ?? null) : null;
  return {
    programId: input.programId,
    targetName: input.targetName,
    targetKind: t.kind,
    raText: typeof typed.ra === "string" ? typed.ra.trim().slice(0, 100) : raDeg === null ? "" : formatRa(raDeg),
    decText: typeof typed.dec === "string" ? typed.dec.trim().slice(0, 100) : decDeg === null ? "" : formatDec(decDeg),
    raDeg,
    decDeg,
    ephemeris: fixed ? null : (t.ephemeris ?? null),
    hMag: fixed ? null : (t.hMag ?? null),
    gSlope: fixed ? null : (t.gSlope ?? null),
    telescopeIds: input.telescopeIds,
    instrumentId: input.instrumentId,
    durationMinutes: input.durationMinutes,
    earliestStart: input.earliestStart,
    latestEnd: input.latestEnd,
    deadline: input.deadline,
    urgency: input.urgency,
    maxAirmass: input.constraints.maxAirmass ?? null,
    darkness: input.constraints.darkness,
    minMoonSeparationDeg: input.constraints.minMoonSeparationDeg ?? null,
    maxMoonIllumination: input.constraints.maxMoonIllumination ?? null,
    justification: input.justification,
  };
}
