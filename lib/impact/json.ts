/** The impact as JSON for the API and the review page: instants as ISO 8601 UTC strings. */
import type { TelescopeImpact } from "./service";

const iso = (ms: number) => new Date(ms).toISOString();
const round2 = (x: number) => Math.round(x * 100) / 100;

export function impactJson(impact: TelescopeImpact) {
  return {
    telescope: { id: impact.telescope.id, code: impact.telescope.code, name: impact.telescope.name, timeZone: impact.telescope.timeZone },
    start: iso(impact.start),
    end: iso(impact.end),
    slotMinutes: impact.slotMinutes,
    creditRatio: impact.creditRatio,
    displacedMinutes: round2(impact.displacedMinutes),
    owedMinutes: round2(impact.owedMinutes),
    approvable: impact.blockedBy.length === 0,
    blockedBy: impact.blockedBy.map((b) => ({ blockId: b.blockId, programCode: b.programCode, start: iso(b.start), end: iso(b.end) })),
    blocks: impact.blocks.map((b) => ({
      ...b,
      blockStart: iso(b.blockStart),
      blockEnd: iso(b.blockEnd),
      lostStart: iso(b.lostStart),
      lostEnd: iso(b.lostEnd),
      minutes: round2(b.minutes),
      owedMinutes: round2(b.owedMinutes),
    })),
    byProgram: impact.byProgram.map((p) => ({ ...p, minutes: round2(p.minutes), owedMinutes: round2(p.owedMinutes) })),
    byObserver: impact.byObserver.map((o) => ({ ...o, minutes: round2(o.minutes), owedMinutes: round2(o.owedMinutes) })),
  };
}

export type ImpactJson = ReturnType<typeof impactJson>;
