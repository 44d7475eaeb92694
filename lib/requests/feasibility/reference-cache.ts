/**
 * The live preview asks about the same few telescopes on every keystroke of every PI:
 * keep the (small) tables of telescopes and instruments for REFERENCE_REUSE_MS instead of
 * reading them on each call. Filing re-reads them from the database (lib/requests/
 * service.ts), so the check that decides never uses a limit older than that.
 */
import type { Db } from "@/db/index";
import { processShared } from "@/lib/process-shared";
import { type InstrumentOption, listInstrumentOptions, listTelescopesForSky } from "../reference-queries";
import type { TelescopeSky } from "./types";

export const REFERENCE_REUSE_MS = 10_000;

interface Reference {
  telescopes: Map<string, TelescopeSky>;
  instruments: Map<string, InstrumentOption>;
}

const state = processShared("preview-reference", () => ({ kept: null as { at: number; reference: Promise<Reference> } | null }));

async function load(db: Db): Promise<Reference> {
  const [telescopes, instruments] = await Promise.all([listTelescopesForSky(db), listInstrumentOptions(db)]);
  return { telescopes: new Map(telescopes.map((t) => [t.id, t])), instruments: new Map(instruments.map((i) => [i.id, i])) };
}

/** The chosen telescopes (undefined where an id is unknown) and instrument, as of at most REFERENCE_REUSE_MS ago. */
export async function previewReference(
  db: Db,
  telescopeIds: readonly string[],
  instrumentId: string | undefined,
  now = Date.now(),
): Promise<{ telescopes: (TelescopeSky | undefined)[]; instrument: InstrumentOption | undefined }> {
  let reference = await keptReference(db, now, false);
  // A telescope or instrument added since: read again at once rather than call it unknown.
  const missing = telescopeIds.some((id) => !reference.telescopes.has(id)) || (instrumentId !== undefined && !reference.instruments.has(instrumentId));
  if (missing) reference = await keptReference(db, now, true);
  return {
    telescopes: telescopeIds.map((id) => reference.telescopes.get(id)),
    instrument: instrumentId ? reference.instruments.get(instrumentId) : undefined,
  };
}

function keptReference(db: Db, now: number, fresh: boolean): Promise<Reference> {
  if (fresh || !state.kept || now - state.kept.at > REFERENCE_REUSE_MS) {
    const reference = load(db);
    state.kept = { at: now, reference };
    reference.catch(() => {
      if (state.kept?.reference === reference) state.kept = null;
    });
  }
  return state.kept.reference;
}
