/**
 * Fixtures for the reference-data tests: valid, parsed inputs with unique codes, so each
 * test can create what it needs through the services without colliding with others.
 */
import { randomUUID } from "node:crypto";
import { getDb } from "@/db/index";
import type { Role } from "@/db/types";
import type { InstrumentInput } from "@/lib/instruments/schemas";
import type { PartnerInput } from "@/lib/partners/schemas";
import type { ProgramInput } from "@/lib/programs/schemas";
import type { SemesterInput } from "@/lib/semesters/schemas";
import type { SiteInput } from "@/lib/sites/schemas";
import type { TelescopeInput } from "@/lib/telescopes/schemas";
import { fixtureSemesterDates, makeUser } from "../fixtures";

export const uniqueCode = (prefix: string) => `${prefix}${randomUUID().slice(0, 8)}`;

export async function makeAdmin() {
  return makeUser(["admin"]);
}

export async function makePerson(roles: Role[]) {
  return makeUser(roles);
}

export function siteInput(overrides: Partial<SiteInput> = {}): SiteInput {
  return { code: uniqueCode("S"), name: "Fixture site", latitudeDeg: -30.5, longitudeDeg: -70.4, heightM: 2300, timeZone: "America/Santiago", ...overrides };
}

export function telescopeInput(siteId: string, overrides: Partial<TelescopeInput> = {}): TelescopeInput {
  return {
    siteId,
    code: uniqueCode("T"),
    name: "Fixture telescope",
    apertureM: 2,
    minAltitudeDeg: 20,
    maxAirmass: 2.5,
    sunAvoidanceDeg: 40,
    hourAngleMinH: -6,
    hourAngleMaxH: 6,
    setupMinutes: 10,
    assistantUserIds: [],
    ...overrides,
  };
}

export function instrumentInput(telescopeId: string, overrides: Partial<InstrumentInput> = {}): InstrumentInput {
  return { telescopeId, code: uniqueCode("I"), name: "Fixture camera", limitingMagnitude: 22.5, ...overrides };
}

/** A semester of its own (fixtureSemesterDates) unless the test gives dates. */
export function semesterInput(overrides: Partial<SemesterInput> = {}): SemesterInput {
  const code = overrides.code ?? uniqueCode("SEM");
  return { code, ...fixtureSemesterDates(code), ...overrides };
}

export function partnerInput(overrides: Partial<PartnerInput> = {}): PartnerInput {
  return { code: uniqueCode("P"), name: "Fixture partner", ...overrides };
}

export function programInput(refs: { semesterId: string; partnerId: string; piUserId: string }, overrides: Partial<ProgramInput> = {}): ProgramInput {
  return { code: uniqueCode("PRG"), title: "Fixture program", rank: 3, allocatedHours: 20, category: "science", tooAllowed: false, observerUserIds: [], ...refs, ...overrides };
}

/** A block written straight to the table: the schedule's own service is not under test here. */
export async function makeBlock(input: { telescopeId: string; programId: string; instrumentId?: string; startsAt: Date; endsAt: Date }) {
  const { id } = await getDb()
    .insertInto("blocks")
    .values({
      telescope_id: input.telescopeId,
      program_id: input.programId,
      instrument_id: input.instrumentId ?? null,
      kind: "science",
      starts_at: input.startsAt,
      ends_at: input.endsAt,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return id;
}

export async function auditActions(entityId: string): Promise<string[]> {
  const rows = await getDb().selectFrom("audit_log").select("action").where("entity_id", "=", entityId).orderBy("id").execute();
  return rows.map((r) => r.action);
}
