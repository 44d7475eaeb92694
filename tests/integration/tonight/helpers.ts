/**
 * Rows for tonight's-queue tests: a site in a chosen time zone with one telescope, its
 * night assistant, a science program, blocks, an approved ToO request and schedule changes.
 * Every call makes its own codes, so test files never share rows.
 */
import { randomUUID } from "node:crypto";
import { getDb } from "@/db/index";
import type { BlockKind, ExecutionOutcome, ScheduleChangeKind } from "@/db/types";
import { makeProgram, makeToken, makeUser } from "../fixtures";

const unique = () => randomUUID().slice(0, 8);

export interface SiteSpec {
  timeZone: string;
  latitudeDeg: number;
  longitudeDeg: number;
}

export const MADRID_SITE: SiteSpec = { timeZone: "Europe/Madrid", latitudeDeg: 38.41, longitudeDeg: -3.72 };
export const SANTIAGO_SITE: SiteSpec = { timeZone: "America/Santiago", latitudeDeg: -30.52, longitudeDeg: -70.41 };

export async function makeNightDesk(spec: SiteSpec) {
  const db = getDb();
  const code = unique();
  const [pi, assistant, observer] = await Promise.all([makeUser(["pi"]), makeUser(["night_assistant"]), makeUser(["observer"])]);
  const site = await db
    .insertInto("sites")
    .values({ code: `S${code}`, name: `Site ${code}`, latitude_deg: spec.latitudeDeg, longitude_deg: spec.longitudeDeg, height_m: 2000, time_zone: spec.timeZone })
    .returning("id")
    .executeTakeFirstOrThrow();
  const telescopeCode = `T${code}`.toUpperCase();
  const telescope = await db
    .insertInto("telescopes")
    .values({ site_id: site.id, code: telescopeCode, name: `Scope ${code}`, aperture_m: 2, min_altitude_deg: 20, max_airmass: 2.5, sun_avoidance_deg: 40, hour_angle_min_h: -6, hour_angle_max_h: 6 })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db.insertInto("telescope_assistants").values({ telescope_id: telescope.id, user_id: assistant.id }).execute();
  const instrument = await db
    .insertInto("instruments")
    .values({ telescope_id: telescope.id, code: `I${code}`, name: `Imager ${code}`, limiting_magnitude: 22 })
    .returning("id")
    .executeTakeFirstOrThrow();
  const program = await makeProgram(code, pi.id, { tooAllowed: true });
  return {
    siteId: site.id,
    telescopeId: telescope.id,
    telescopeCode,
    instrumentId: instrument.id,
    programId: program.id,
    programCode: `PRG${code}`,
    pi,
    assistant,
    observer,
  };
}

export type NightDesk = Awaited<ReturnType<typeof makeNightDesk>>;

export async function addBlock(desk: NightDesk, startsAt: string, endsAt: string, opts: { kind?: BlockKind; tooRequestId?: string } = {}): Promise<string> {
  const row = await getDb()
    .insertInto("blocks")
    .values({
      telescope_id: desk.telescopeId,
      program_id: desk.programId,
      observer_user_id: desk.observer.id,
      instrument_id: desk.instrumentId,
      kind: opts.kind ?? "science",
      starts_at: startsAt,
      ends_at: endsAt,
      too_request_id: opts.tooRequestId ?? null,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** An approved, complete ToO request (every column the filed-state CHECK asks for). */
export async function addApprovedRequest(
  desk: NightDesk,
  target: { name: string; raDeg: number; decDeg: number; justification?: string },
  window: { start: string; end: string },
): Promise<string> {
  const row = await getDb()
    .insertInto("too_requests")
    .values({
      pi_user_id: desk.pi.id,
      program_id: desk.programId,
      target_name: target.name,
      target_kind: "fixed",
      ra_text: String(target.raDeg),
      dec_text: String(target.decDeg),
      ra_deg: target.raDeg,
      dec_deg: target.decDeg,
      instrument_id: desk.instrumentId,
      duration_minutes: 60,
      earliest_start: window.start,
      latest_end: window.end,
      deadline: window.end,
      urgency: "tonight",
      darkness: "nautical",
      justification: target.justification ?? "A fading transient needs colours tonight.",
      state: "approved",
      submitted_at: window.start,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

/** An approved request for a moving target given by an ephemeris table. */
export async function addApprovedMovingRequest(desk: NightDesk, name: string, rows: Array<{ time: string; ra: number; dec: number }>, window: { start: string; end: string }): Promise<string> {
  const row = await getDb()
    .insertInto("too_requests")
    .values({
      pi_user_id: desk.pi.id,
      program_id: desk.programId,
      target_name: name,
      target_kind: "ephemeris",
      ephemeris: JSON.stringify(rows),
      instrument_id: desk.instrumentId,
      duration_minutes: 60,
      earliest_start: window.start,
      latest_end: window.end,
      deadline: window.end,
      urgency: "tonight",
      darkness: "astronomical",
      justification: "A small body on close approach.",
      state: "approved",
      submitted_at: window.start,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return row.id;
}

export async function addAttachment(requestId: string, uploadedBy: string, kind: "finding_chart" | "justification", fileName: string): Promise<void> {
  await getDb()
    .insertInto("attachments")
    .values({ request_id: requestId, kind, file_name: fileName, content_type: "image/png", size_bytes: 1234, storage_key: `key-${unique()}`, url: `http://127.0.0.1:9/files/${fileName}`, uploaded_by: uploadedBy })
    .execute();
}

export async function addChange(
  desk: NightDesk,
  change: { kind: ScheduleChangeKind; startsAt: string; endsAt: string; summary: string; blockId?: string; requestId?: string },
): Promise<number> {
  const row = await getDb()
    .insertInto("schedule_changes")
    .values({
      telescope_id: desk.telescopeId,
      kind: change.kind,
      starts_at: change.startsAt,
      ends_at: change.endsAt,
      summary: change.summary,
      block_id: change.blockId ?? null,
      request_id: change.requestId ?? null,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return Number(row.id);
}

export async function addExecution(blockId: string, outcome: ExecutionOutcome, loggedBy: string): Promise<void> {
  await getDb().insertInto("block_executions").values({ block_id: blockId, outcome, logged_by: loggedBy }).execute();
}

export async function userWithToken(roles: Parameters<typeof makeUser>[0]) {
  const user = await makeUser(roles);
  return { ...user, roles, token: await makeToken(user.id) };
}

/** Calls a route handler the way Next does, with a bearer token. */
export async function call<P>(
  handler: (r: Request, c: { params: Promise<P> }) => Promise<Response>,
  init: { url: string; token?: string; method?: string; body?: unknown; params: P },
): Promise<{ status: number; body: Record<string, unknown> }> {
  const headers: Record<string, string> = init.token ? { authorization: `Bearer ${init.token}` } : {};
  const response = await handler(
    new Request(init.url, { method: init.method ?? "GET", headers, body: init.body === undefined ? undefined : JSON.stringify(init.body) }),
    { params: Promise.resolve(init.params) },
  );
  return { status: response.status, body: (await response.json()) as Record<string, unknown> };
}
