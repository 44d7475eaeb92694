/**
 * Random sequences of approvals through approveRequest on the real database: after every
 * sequence the telescope has no overlapping blocks, every request's credits equal its
 * displaced minutes × the ratio and its charge the slot, each approval displaced exactly
 * what the impact preview promised, and the ledger's lines sum to its totals.
 */
import fc from "fast-check";
import { afterAll, afterEach, describe, expect, it } from "vitest";
import { getDb } from "@/db/index";
import { approveRequest } from "@/lib/decisions/approve";
import { SlotTakenError } from "@/lib/decisions/errors";
import { computeImpact } from "@/lib/impact/compute";
import { listImpactBlocks } from "@/lib/impact/queries";
import { getLedger } from "@/lib/ledger/service";
import { closeNoticeQueue } from "@/lib/notices/queue";
import { makeSubmittedRequest, makeWorld } from "../decisions/world";
import { displacedMinutes, ledgerMinutes, setCreditRatio } from "./helpers";

afterEach(async () => {
  await setCreditRatio(1);
});
afterAll(async () => {
  await closeNoticeQueue();
});

const DAY = Date.parse("2027-05-01T00:00:00Z");
const QUARTER = 15 * 60_000;
let dayOffset = 0;

const approvals = fc.array(fc.record({ start: fc.integer({ min: 0, max: 44 }), length: fc.integer({ min: 1, max: 16 }) }), { minLength: 1, maxLength: 6 });
const blocksOfNight = fc.array(fc.integer({ min: 1, max: 12 }), { minLength: 1, maxLength: 5 });

describe("invariants of the splice and the ledger over random approvals", () => {
  it("holds for every random sequence", async () => {
    await fc.assert(
      fc.asyncProperty(blocksOfNight, approvals, fc.constantFrom(1, 2, 0.5), async (lengths, sequence, ratio) => {
        await setCreditRatio(ratio);
        const base = DAY + dayOffset++ * 86_400_000;
        let at = base;
        const night = lengths.map((n): [string, string] => {
          const start = at;
          at += n * QUARTER;
          return [new Date(start).toISOString(), new Date(at).toISOString()];
        });
        const world = await makeWorld(night);
        const db = getDb();
        for (const step of sequence) {
          const start = base + step.start * QUARTER;
          const end = start + step.length * QUARTER;
          const requestId = await makeSubmittedRequest(world);
          const before = await listImpactBlocks(db, [world.telescopeId], new Date(start), new Date(end));
          const preview = computeImpact({ start, end }, before, ratio);
          try {
            const result = await approveRequest(db, world.director, { requestId, telescopeId: world.telescopeId, start: new Date(start), end: new Date(end) });
            expect(preview.blockedBy).toEqual([]);
            expect(result.displacedMinutes).toBe(preview.displacedMinutes);
            expect(await displacedMinutes({ requestId })).toBe(preview.displacedMinutes);
            expect(await ledgerMinutes({ requestId, kind: "credit" })).toBeCloseTo(preview.displacedMinutes * ratio, 9);
            expect(await ledgerMinutes({ requestId, kind: "charge" })).toBe((end - start) / 60_000);
          } catch (e) {
            // Refused only where the preview saw another override in the way.
            expect(e).toBeInstanceOf(SlotTakenError);
            expect(preview.blockedBy.length).toBeGreaterThan(0);
          }
        }
        const blocks = await db.selectFrom("blocks").select(["starts_at", "ends_at"]).where("telescope_id", "=", world.telescopeId).orderBy("starts_at").execute();
        for (let i = 1; i < blocks.length; i++) expect(blocks[i]!.starts_at.getTime()).toBeGreaterThanOrEqual(blocks[i - 1]!.ends_at.getTime());
        // Credited = displaced × ratio for the world's displaced program, over the whole sequence.
        expect(await ledgerMinutes({ programId: world.programId, kind: "credit" })).toBeCloseTo((await displacedMinutes({ programId: world.programId })) * ratio, 9);
        const ledger = await getLedger(db, world.director);
        const sum = (key: "chargedMinutes" | "creditedMinutes" | "repaidMinutes" | "owedMinutes") => ledger.programs.reduce((s, p) => s + p[key], 0);
        expect(ledger.totals.chargedMinutes).toBeCloseTo(sum("chargedMinutes"), 6);
        expect(ledger.totals.creditedMinutes).toBeCloseTo(sum("creditedMinutes"), 6);
        expect(ledger.totals.owedMinutes).toBeCloseTo(sum("creditedMinutes") - sum("repaidMinutes"), 6);
        expect(ledger.semesters.reduce((s, x) => s + x.owedMinutes, 0)).toBeCloseTo(ledger.totals.owedMinutes, 6);
        expect(ledger.partners.reduce((s, x) => s + x.creditedMinutes, 0)).toBeCloseTo(ledger.totals.creditedMinutes, 6);
      }),
      { numRuns: 15 },
    );
  }, 180_000);
});
