/**
 * The rules of a ToO request's life on the PI's side: save a draft as it is typed, file it
 * (feasibility first: sun avoidance and an observable window before the deadline, or it
 * is refused with the reasons), withdraw it. Every state change writes a request_events
 * row and an audit row in the same transaction as the change.
 */
import type { Db, Trx } from "@/db/index";
import type { RequestState } from "@/db/types";
import { writeAudit } from "@/lib/audit/queries";
import { noticeRequestSubmitted } from "@/lib/notices/notify";
import type { User } from "@/lib/users/queries";
import { RequestFieldError, RequestNotFoundError, RequestRefusedError, RequestStateError } from "./errors";
import { computeFeasibility } from "./feasibility/compute";
import { toSnapshot } from "./feasibility/snapshot";
import type { FeasibilityReport, InstrumentRef, TelescopeSky } from "./feasibility/types";
import { draftFields, filedFields, type RequestFields } from "./fields-map";
import { findRequestById, insertRequest, insertRequestEvent, lockRequest, setRequestState, updateRequestFields } from "./queries";
import { findInstrumentOption, findProgramForFiling, listTelescopesForSky } from "./reference-queries";
import type { DraftInput, RequestInput } from "./schemas";
import type { TooRequest } from "./types";

export type Actor = Pick<User, "id" | "roles">;

/** States from which the PI may still withdraw. */
const WITHDRAWABLE: readonly RequestState[] = ["submitted", "in_review"];

async function lockOwnDraft(trx: Trx, actor: Actor, id: string): Promise<void> {
  const row = await lockRequest(trx, id);
  if (!row || row.piUserId !== actor.id) throw new RequestNotFoundError();
  if (row.state !== "draft") throw new RequestStateError("This request has been filed and can no longer be edited; you may still withdraw it.");
}

/** Drops references a draft cannot keep (someone else's program, unknown telescopes), so the autosave never fails on them. */
async function keepValidReferences(db: Db | Trx, actor: Actor, fields: RequestFields): Promise<RequestFields> {
  const program = fields.programId ? await findProgramForFiling(db, fields.programId) : undefined;
  const telescopes = fields.telescopeIds.length ? await listTelescopesForSky(db, fields.telescopeIds) : [];
  const instrument = fields.instrumentId ? await findInstrumentOption(db, fields.instrumentId) : undefined;
  return {
    ...fields,
    programId: program && program.piUserId === actor.id ? fields.programId : null,
    telescopeIds: fields.telescopeIds.filter((id) => telescopes.some((t) => t.id === id)),
    instrumentId: instrument ? fields.instrumentId : null,
  };
}

/** Creates the draft (id null) or replaces its fields. Anything typed is kept; nothing is checked for completeness. */
export async function saveDraft(db: Db, actor: Actor, id: string | null, input: DraftInput): Promise<{ id: string; updatedAt: Date }> {
  const fields = await keepValidReferences(db, actor, draftFields(input));
  return db.transaction().execute(async (trx) => {
    if (id === null) {
      const created = await insertRequest(trx, actor.id, "form", fields);
      await insertRequestEvent(trx, { requestId: created, actorUserId: actor.id, from: null, to: "draft", note: "Draft started." });
      await writeAudit(trx, { actorUserId: actor.id, action: "request.draft", entity: "too_request", entityId: created });
      return { id: created, updatedAt: new Date() };
    }
    await lockOwnDraft(trx, actor, id);
    await updateRequestFields(trx, id, fields);
    return { id, updatedAt: new Date() };
  });
}

export interface PreparedFiling {
  input: RequestInput;
  fields: RequestFields;
  telescopes: TelescopeSky[];
  instrument: InstrumentRef;
  programCode: string;
  report: FeasibilityReport;
}

/**
 * Everything that can refuse a filing before any row is locked: the references, then the
 * feasibility check (CPU work, kept out of the transaction). Throws RequestFieldError or
 * RequestRefusedError.
 */
export async function prepareFiling(db: Db | Trx, actor: Actor, input: RequestInput, now: Date, typed: { ra?: unknown; dec?: unknown } = {}): Promise<PreparedFiling> {
  const program = await findProgramForFiling(db, input.programId);
  if (!program || program.piUserId !== actor.id) throw new RequestFieldError({ programId: "Choose one of your own programs." });
  if (!program.tooAllowed) throw new RequestFieldError({ programId: `${program.code} has no target-of-opportunity time.` });
  const telescopes = await listTelescopesForSky(db, input.telescopeIds);
  if (telescopes.length !== input.telescopeIds.length) throw new RequestFieldError({ telescopeIds: "One of the chosen telescopes does not exist." });
  const instrument = await findInstrumentOption(db, input.instrumentId);
  if (!instrument || !input.telescopeIds.includes(instrument.telescopeId)) {
    throw new RequestFieldError({ instrumentId: "Choose an instrument on one of the acceptable telescopes." });
  }
  const report = computeFeasibility(input, telescopes, instrument, now);
  if (report.verdict === "refused") throw new RequestRefusedError(report);
  return { input, fields: filedFields(input, typed), telescopes, instrument, programCode: program.code, report };
}

/**
 * Files a prepared request inside the caller's transaction: the draft `draftId` (locked,
 * must be the actor's draft) or a new request. Returns the request's id.
 */
export async function fileInTransaction(trx: Trx, actor: Actor, prepared: PreparedFiling, options: { draftId?: string; source: "form" | "api"; now: Date }): Promise<string> {
  let id: string;
  let from: RequestState | null;
  if (options.draftId) {
    await lockOwnDraft(trx, actor, options.draftId);
    await updateRequestFields(trx, options.draftId, prepared.fields);
    id = options.draftId;
    from = "draft";
  } else {
    id = await insertRequest(trx, actor.id, options.source, prepared.fields);
    from = null;
  }
  await setRequestState(trx, id, "submitted", { submittedAt: options.now, feasibility: toSnapshot(prepared.report) });
  await insertRequestEvent(trx, { requestId: id, actorUserId: actor.id, from, to: "submitted", note: options.source === "api" ? "Filed through the API." : "" });
  await writeAudit(trx, { actorUserId: actor.id, action: "request.submit", entity: "too_request", entityId: id, details: { source: options.source } });
  await tellDirectors(trx, id, prepared, options.now);
  return id;
}

async function tellDirectors(trx: Trx, id: string, prepared: PreparedFiling, now: Date): Promise<void> {
  const request = await findRequestById(trx, id);
  const first = prepared.telescopes[0];
  if (!request || !first) return;
  const slot = prepared.report.telescopes.find((t) => t.firstSlot)?.firstSlot ?? null;
  await noticeRequestSubmitted(trx, {
    requestId: id,
    targetName: prepared.input.targetName,
    programCode: prepared.programCode,
    programTitle: request.programTitle ?? prepared.programCode,
    piName: request.piName,
    urgency: prepared.input.urgency,
    deadline: prepared.input.urgency === "within_days" ? prepared.input.deadline : null,
    submittedAt: now,
    requestedMinutes: prepared.input.durationMinutes,
    telescopes: prepared.telescopes.map((t) => ({ code: t.code, name: t.name })),
    site: { code: first.site.code, name: first.site.name, timeZone: first.site.timeZone },
    firstWindow: slot ? { startsAt: new Date(slot.start), endsAt: new Date(slot.end) } : null,
    justification: prepared.input.justification.slice(0, 600),
  });
}

/** Checks, then files (the draft `draftId`, or a new request) in one transaction. */
export async function fileRequest(
  db: Db,
  actor: Actor,
  input: RequestInput,
  options: { draftId?: string; source: "form" | "api"; now?: Date; typed?: { ra?: unknown; dec?: unknown } },
): Promise<{ id: string; report: FeasibilityReport }> {
  const now = options.now ?? new Date();
  const prepared = await prepareFiling(db, actor, input, now, options.typed);
  const id = await db.transaction().execute((trx) => fileInTransaction(trx, actor, prepared, { draftId: options.draftId, source: options.source, now }));
  return { id, report: prepared.report };
}

export async function withdrawRequest(db: Db, actor: Actor, id: string, note = ""): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const row = await lockRequest(trx, id);
    if (!row || row.piUserId !== actor.id) throw new RequestNotFoundError();
    if (row.state === "draft") throw new RequestStateError("A draft has not been filed, so there is nothing to withdraw.");
    if (row.state === "withdrawn") throw new RequestStateError("This request has already been withdrawn.");
    if (row.state === "lapsed") throw new RequestStateError("This request lapsed at its deadline before a decision; there is nothing left to withdraw.");
    if (!WITHDRAWABLE.includes(row.state)) {
      throw new RequestStateError("Only a submitted request or one in review can be withdrawn; ask the director about a decided one.");
    }
    await setRequestState(trx, id, "withdrawn");
    await insertRequestEvent(trx, { requestId: id, actorUserId: actor.id, from: row.state, to: "withdrawn", note });
    await writeAudit(trx, { actorUserId: actor.id, action: "request.withdraw", entity: "too_request", entityId: id, details: { from: row.state } });
  });
}

/** A PI sees their own requests; a director sees every filed one (never someone's draft). */
export async function findRequestForViewer(db: Db | Trx, viewer: Actor, id: string): Promise<TooRequest | undefined> {
  const request = await findRequestById(db, id);
  if (!request) return undefined;
  if (request.piUserId === viewer.id) return request;
  if (viewer.roles.includes("director") && request.state !== "draft") return request;
  return undefined;
}
