/**
 * Tonight's queue for one telescope and one night: the blocks in time order with their
 * state, ToO details and live figures, the changes this viewer has not acknowledged, and
 * who acknowledged what. Read-only; the route, the page and the poller all call this.
 */
import type { Db } from "@/db/index";
import type { DarknessLevel, Role } from "@/db/types";
import { Ephemeris } from "@/lib/sky";
import { blockState } from "./block-state";
import { TonightFieldError, TonightNotFoundError } from "./errors";
import { nightAt, NightNotAtSiteError, tonightOf } from "./night";
import { onSkyFigures } from "./on-sky";
import { summarise } from "./summary";
import { nightSnapshot } from "./night-snapshots";
import { findTelescopeByRef, loadChangesAfter, type QueueBlockRow, type QueueTelescopeRow } from "./queries";
import { viewOf } from "./viewer-view";
import type { OnSkyFigures, QueueBlock, QueueNight, QueueTarget, TonightQueue } from "./types";

export interface Viewer {
  id: string;
  roles: readonly Role[];
}

const CHANGES_LISTED = 100;
// A night with more changes than this (never seen) reads the viewer's own from the database.
const CHANGES_IN_SNAPSHOT = 1000;
const ACKNOWLEDGEMENTS_LISTED = 10;

function ephemerisOf(rows: NonNullable<QueueBlockRow["too"]>["ephemeris"]): Ephemeris | null {
  if (!rows || rows.length < 2) return null;
  try {
    return new Ephemeris(
      rows.map((r) => ({ time: Date.parse(r.time), raDeg: r.ra, decDeg: r.dec, rAu: r.rAu, deltaAu: r.deltaAu, magnitude: r.magnitude })),
    );
  } catch {
    return null; // a malformed table: show the block without live figures rather than fail the queue
  }
}

function dawnFor(night: QueueNight, darkness: DarknessLevel): number | null {
  const at = { civil: night.civilDawn, nautical: night.nauticalDawn, astronomical: night.astronomicalDawn }[darkness] ?? night.sunrise;
  return at === null ? null : Date.parse(at);
}

// The on-sky scan costs a few hundred sky positions: keep one answer per block per minute.
const onSkyCache = new Map<string, OnSkyFigures | null>();
const ON_SKY_CACHED = 256;

function liveFigures(
  block: QueueBlockRow,
  telescope: QueueTelescopeRow,
  night: QueueNight,
  now: Date,
  ephemeris: Ephemeris | null,
): OnSkyFigures | null {
  const too = block.too;
  if (!too) return null;
  const key = `${block.id}|${too.raDeg}|${too.decDeg}|${Math.floor(now.getTime() / 60_000)}`;
  let figures = onSkyCache.get(key);
  if (figures === undefined) {
    const target =
      too.targetKind === "fixed" && too.raDeg !== null && too.decDeg !== null
        ? ({ kind: "fixed", raDeg: too.raDeg, decDeg: too.decDeg } as const)
        : ephemeris
          ? ({ kind: "ephemeris", ephemeris } as const)
          : null;
    figures = target
      ? onSkyFigures({
          target,
          site: telescope.site,
          telescope,
          dawn: dawnFor(night, too.darkness),
          nightEnd: Date.parse(night.end),
          now: now.getTime(),
        })
      : null;
    if (onSkyCache.size >= ON_SKY_CACHED) onSkyCache.delete(onSkyCache.keys().next().value ?? "");
    onSkyCache.set(key, figures);
  }
  if (!figures) return null;
  return { ...figures, minutesLeft: Math.max(0, Math.floor((Date.parse(figures.until) - now.getTime()) / 60_000)) };
}

function targetOf(too: NonNullable<QueueBlockRow["too"]>, ephemeris: Ephemeris | null, now: Date): QueueTarget {
  if (too.targetKind === "fixed") {
    return { kind: "fixed", raDeg: too.raDeg, decDeg: too.decDeg, raText: too.raText, decText: too.decText, ephemerisRows: 0 };
  }
  const sample = ephemeris?.at(now.getTime()) ?? null;
  return { kind: "ephemeris", raDeg: sample?.raDeg ?? null, decDeg: sample?.decDeg ?? null, raText: "", decText: "", ephemerisRows: too.ephemerisRows };
}

// Telescopes and sites change a few times a semester; the queue is polled every few
// seconds by every open page. Keep each lookup for a short while.
const TELESCOPE_TTL_MS = 30_000;
const telescopeCache = new Map<string, { at: number; row: QueueTelescopeRow }>();

async function telescopeFor(db: Db, ref: string, now: number): Promise<QueueTelescopeRow | undefined> {
  const key = ref.toUpperCase();
  const hit = telescopeCache.get(key);
  if (hit && now - hit.at < TELESCOPE_TTL_MS) return hit.row;
  const row = await findTelescopeByRef(db, ref);
  if (row) {
    if (telescopeCache.size >= 64) telescopeCache.clear();
    telescopeCache.set(key, { at: now, row });
  }
  return row;
}

/** `maxAgeMs`: how old a shared night snapshot may be (the polled route passes a second; pages and tests read fresh). */
export async function getTonightQueue(
  db: Db,
  viewer: Viewer,
  telescopeRef: string,
  nightOf: string | undefined,
  now = new Date(),
  options: { maxAgeMs?: number } = {},
): Promise<TonightQueue> {
  const telescope = await telescopeFor(db, telescopeRef, Date.now());
  if (!telescope) throw new TonightNotFoundError(`There is no telescope "${telescopeRef}".`);
  let night: QueueNight;
  try {
    night = nightAt(telescope.site, nightOf ?? tonightOf(telescope.site, now));
  } catch (error) {
    if (error instanceof NightNotAtSiteError) throw new TonightFieldError("night", `No night begins on ${nightOf} at ${telescope.siteName}: its clocks skipped that date.`);
    throw error;
  }

  const from = new Date(night.start);
  const snapshot = await nightSnapshot(
    db,
    { telescopeId: telescope.id, from, to: new Date(night.end), changesSince: from, changesCap: CHANGES_IN_SNAPSHOT, acknowledgementsLimit: ACKNOWLEDGEMENTS_LISTED },
    options.maxAgeMs ?? 0,
  );
  const view = viewOf(snapshot, viewer, CHANGES_LISTED);
  const operate = view.operate;
  const changes =
    view.changes ?? (await loadChangesAfter(db, { telescopeId: telescope.id, changesSince: from, watermark: view.watermark, limit: CHANGES_LISTED }));

  const changedBlocks = new Set(changes.items.flatMap((c) => (c.blockId ? [c.blockId] : [])));
  const changedRequests = new Set(changes.items.flatMap((c) => (c.requestId ? [c.requestId] : [])));

  const blocks = snapshot.blocks.map((b): QueueBlock => {
    const state = blockState({ startsAt: new Date(b.startsAt), endsAt: new Date(b.endsAt) }, now, b.execution?.outcome ?? null);
    const ephemeris = b.too?.targetKind === "ephemeris" ? ephemerisOf(b.too.ephemeris) : null;
    return {
      id: b.id,
      kind: b.kind,
      startsAt: b.startsAt,
      endsAt: b.endsAt,
      state,
      programCode: b.programCode,
      programTitle: b.programTitle,
      observerName: b.observerName,
      instrumentCode: b.instrumentCode,
      instrumentName: b.instrumentName,
      changed: changedBlocks.has(b.id) || (b.too !== null && changedRequests.has(b.too.requestId)),
      too: b.too && {
        requestId: b.too.requestId,
        requestState: b.too.state,
        targetName: b.too.targetName,
        target: targetOf(b.too, ephemeris, now),
        justification: b.too.justification,
        justificationSummary: summarise(b.too.justification),
        attachments: b.too.attachments,
      },
      execution: b.execution,
      onSky: state === "on_sky" ? liveFigures(b, telescope, night, now, ephemeris) : null,
    };
  });

  return {
    telescope: {
      id: telescope.id,
      code: telescope.code,
      name: telescope.name,
      siteName: telescope.siteName,
      timeZone: telescope.site.timeZone,
      maxAirmass: telescope.maxAirmass,
      minAltitudeDeg: telescope.minAltitudeDeg,
    },
    night,
    now: now.toISOString(),
    blocks,
    changes: {
      basis: operate ? "mine" : "telescope",
      items: changes.items,
      more: Math.max(0, changes.total - changes.items.length),
      throughChangeId: changes.items.length ? Math.max(...changes.items.map((c) => c.id)) : null,
    },
    acknowledgements: { mine: operate ? view.mine : null, recent: snapshot.recent },
    permissions: { canAcknowledge: operate, canLog: operate },
  };
}
