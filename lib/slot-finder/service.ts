/**
 * The slot finder for a stored request: loads the acceptable telescopes, the schedule
 * over the request's usable time and the consortium's setup setting, asks the sky engine
 * for the windows, and ranks the slots (find-slots.ts). Read-only.
 *
 * The usable time ends where the feasibility check's horizon does: at the earliest of the
 * latest end, the deadline and the instant a moving target fades past the chosen
 * instrument's limit (the fading clock).
 */
import type { Db } from "@/db/index";
import { listImpactBlocks, listTelescopeSetupMinutes } from "@/lib/impact/queries";
import { getInterruptSetupMinutes } from "@/lib/ledger/policy";
import { type FadeCut, fadingOf } from "@/lib/requests/feasibility/fading";
import { feasibilityInputOf } from "@/lib/requests/feasibility/from-request";
import type { InstrumentRef } from "@/lib/requests/feasibility/types";
import { findInstrumentOption, listTelescopesForSky } from "@/lib/requests/reference-queries";
import type { FeasibilityInput } from "@/lib/requests/schemas";
import type { TooRequest } from "@/lib/requests/types";
import { findSlots } from "./find-slots";
import { skyWindows } from "./sky";
import type { FinderTelescope, SlotFinderResult } from "./types";

export interface RequestSlots extends SlotFinderResult {
  usable: { start: number; end: number };
  telescopes: Array<{ id: string; code: string; name: string; timeZone: string; setupMinutes: number }>;
}

export function usableTime(request: Pick<TooRequest, "earliestStart" | "latestEnd" | "deadline">, now: Date): { start: number; end: number } {
  const start = Math.max(request.earliestStart?.getTime() ?? now.getTime(), now.getTime());
  const ends = [request.latestEnd, request.deadline].filter((d): d is Date => d !== null).map((d) => d.getTime());
  return { start, end: ends.length ? Math.min(...ends) : start };
}

/** The usable time cut where the target fades past the instrument's limit, and the cut (null when it stays bright enough). */
export function fadedUsableTime(
  target: FeasibilityInput["target"],
  instrument: InstrumentRef | null,
  usable: { start: number; end: number },
): { usable: { start: number; end: number }; fade: FadeCut | null } {
  const { cut } = fadingOf(target, instrument, usable.start, usable.end);
  return { usable: cut ? { start: usable.start, end: cut.at } : usable, fade: cut };
}

export async function findSlotsForRequest(db: Db, request: TooRequest, now: Date, limit?: number): Promise<RequestSlots> {
  const requested = usableTime(request, now);
  const ids = request.telescopes.map((t) => t.id);
  const [skies, setups, interruptSetupMinutes, instrument] = await Promise.all([
    listTelescopesForSky(db, ids),
    listTelescopeSetupMinutes(db, ids),
    getInterruptSetupMinutes(db),
    request.instrumentId ? findInstrumentOption(db, request.instrumentId) : undefined,
  ]);
  const telescopes = skies.map((t) => ({ id: t.id, code: t.code, name: t.name, timeZone: t.site.timeZone, setupMinutes: setups.get(t.id) ?? 0 }));
  const input = feasibilityInputOf(request);
  if (!input || !request.durationMinutes) {
    return { suggestions: [], considered: 0, reason: "The request is incomplete: its target, window or duration is missing.", note: null, usable: requested, telescopes };
  }
  const { usable, fade } = fadedUsableTime(input.target, instrument ?? null, requested);
  const blocks = usable.end > usable.start ? await listImpactBlocks(db, ids, new Date(usable.start), new Date(usable.end)) : [];
  const finderTelescopes: FinderTelescope[] = skies.map((t) => {
    const sky = skyWindows(input, t, usable);
    return {
      telescopeId: t.id,
      code: t.code,
      setupMinutes: setups.get(t.id) ?? 0,
      windows: sky.windows,
      airmass: sky.airmass,
      blocks: blocks.filter((b) => b.telescopeId === t.id).map((b) => ({ id: b.id, start: b.start, end: b.end, kind: b.kind, programId: b.programId, programCode: b.programCode, rank: b.programRank })),
    };
  });
  const result = findSlots({
    now: now.getTime(),
    durationMinutes: request.durationMinutes,
    urgency: request.urgency ?? "within_days",
    // The request's own usable time and the fade: the finder cuts one by the other, and says so.
    horizon: requested,
    fade,
    telescopes: finderTelescopes,
    interruptSetupMinutes,
    limit,
  });
  return { ...result, usable, telescopes };
}
