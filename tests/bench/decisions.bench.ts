/**
 * The director's decision, measured on a fresh seeded database of its own:
 * - the slot finder over three telescopes and 14 nights (target < 150 ms), whole (sky
 *   engine + schedule + ranking) and its pure ranking core alone;
 * - the splice: ~100 approvals through approveRequest, p95 (target < 100 ms);
 * - 50 concurrent conflicting approvals: exactly one wins, and how long they all take.
 *
 *   node_modules/.bin/tsx tests/bench/decisions.bench.ts
 *
 * Needs PG_ADMIN_URL (scripts/lib.sh `pg_start` exports it); makes and drops a database.
 */
import { percentile, throwawayDatabase } from "./bench-support";

const APPROVALS = 99;
const CONCURRENT = 50;
const RUNS = 12;
const HOUR = 3_600_000;
const MINUTE = 60_000;

const ms = (x: number) => `${x.toFixed(1)} ms`;
function describeTimes(times: number[]): string {
  const s = [...times].sort((a, b) => a - b);
  return `p50 ${ms(percentile(s, 50))}, p95 ${ms(percentile(s, 95))}, max ${ms(s.at(-1) ?? NaN)}`;
}

async function main(): Promise<void> {
  const database = await throwawayDatabase("nightbreak_bench_decisions");
  const url = database.url;

  const { createDb, getDb } = await import("../../db/index");
  const { migrateToLatest } = await import("../../db/migrate");
  const { seedDemo } = await import("../../db/seed");
  const { approveRequest } = await import("../../lib/decisions/approve");
  const { SlotTakenError } = await import("../../lib/decisions/errors");
  const { closeNoticeQueue, getNoticeQueue } = await import("../../lib/notices/queue");
  const { findRequestById } = await import("../../lib/requests/queries");
  const { feasibilityInputOf } = await import("../../lib/requests/feasibility/from-request");
  const { listTelescopesForSky } = await import("../../lib/requests/reference-queries");
  const { findSlotsForRequest, usableTime } = await import("../../lib/slot-finder/service");
  const { findSlots } = await import("../../lib/slot-finder/find-slots");
  const { skyWindows } = await import("../../lib/slot-finder/sky");
  const { listImpactBlocks } = await import("../../lib/impact/queries");
  const { findUserById } = await import("../../lib/users/queries");

  const setup = createDb(url, 1);
  await migrateToLatest(setup);
  const seeded = await seedDemo(setup, { passwordHash: "-" });
  await setup.destroy();

  try {
    const db = getDb();
    const now = new Date();
    const director = await findUserById(db, (await db.selectFrom("users").select("id").where("email", "=", "director@nightbreak.test").executeTakeFirstOrThrow()).id);
    if (!director) throw new Error("no director in the seed");
    const too = await db.selectFrom("programs").select(["id", "pi_user_id"]).where("code", "=", "TOO-01").executeTakeFirstOrThrow();
    const telescopes = await db.selectFrom("telescopes").select(["id", "code"]).orderBy("code").execute();
    const instrument = await db.selectFrom("instruments").select("id").where("code", "=", "LYRA").executeTakeFirstOrThrow();
    // A target opposite the Sun on the sky, up all night at both sites.
    const dayOfYear = (now.getTime() - Date.UTC(now.getUTCFullYear(), 0, 1)) / 86_400_000;
    const raDeg = (((dayOfYear - 80) * 360) / 365.25 + 180 + 360) % 360;

    async function makeRequest(name: string, days = 14): Promise<string> {
      const { id } = await db
        .insertInto("too_requests")
        .values({
          pi_user_id: too.pi_user_id,
          program_id: too.id,
          target_name: name,
          target_kind: "fixed",
          ra_deg: raDeg,
          dec_deg: 0,
          instrument_id: instrument.id,
          duration_minutes: 60,
          earliest_start: now,
          latest_end: new Date(now.getTime() + days * 24 * HOUR),
          deadline: new Date(now.getTime() + days * 24 * HOUR),
          urgency: "within_days",
          darkness: "nautical",
          state: "submitted",
          submitted_at: now,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await db.insertInto("too_request_telescopes").values(telescopes.map((t) => ({ request_id: id, telescope_id: t.id }))).execute();
      return id;
    }

    console.log(`decisions bench: seeded ${seeded.blocks} blocks on ${telescopes.length} telescopes`);

    // 1. The slot finder, whole and core.
    const request = await findRequestById(db, await makeRequest("Bench transient"));
    if (!request) throw new Error("bench request missing");
    const whole: number[] = [];
    let suggestions = 0;
    for (let i = 0; i < RUNS; i++) {
      const started = performance.now();
      const result = await findSlotsForRequest(db, request, now);
      if (i > 0) whole.push(performance.now() - started); // the first run warms the JIT
      suggestions = result.suggestions.length;
    }
    const usable = usableTime(request, now);
    const input = feasibilityInputOf(request);
    if (!input) throw new Error("bench request incomplete");
    const skies = await listTelescopesForSky(db, telescopes.map((t) => t.id));
    const skyTimes: number[] = [];
    let windows: ReturnType<typeof skyWindows>[] = [];
    for (let i = 0; i < RUNS; i++) {
      const started = performance.now();
      windows = skies.map((t) => skyWindows(input, t, usable));
      if (i > 0) skyTimes.push(performance.now() - started);
    }
    const blocks = await listImpactBlocks(db, telescopes.map((t) => t.id), new Date(usable.start), new Date(usable.end));
    const finderInput = {
      now: now.getTime(),
      durationMinutes: 60,
      urgency: "within_days" as const,
      horizon: usable,
      interruptSetupMinutes: 10,
      telescopes: skies.map((t, k) => ({
        telescopeId: t.id,
        code: t.code,
        setupMinutes: 10,
        windows: windows[k]?.windows ?? [],
        airmass: windows[k]?.airmass ?? [],
        blocks: blocks.filter((b) => b.telescopeId === t.id).map((b) => ({ id: b.id, start: b.start, end: b.end, kind: b.kind, programId: b.programId, programCode: b.programCode, rank: b.programRank })),
      })),
    };
    const core: number[] = [];
    let considered = 0;
    for (let i = 0; i < RUNS * 4; i++) {
      const started = performance.now();
      considered = findSlots(finderInput).considered;
      if (i > 0) core.push(performance.now() - started);
    }
    const nWindows = windows.reduce((s, w) => s + w.windows.length, 0);
    console.log(`  slot finder, 3 telescopes × 14 nights (${nWindows} windows, ${blocks.length} blocks, ${considered} candidates → ${suggestions} suggestions):`);
    console.log(`    whole (sky engine + schedule + ranking): ${describeTimes(whole)}  [target < 150 ms]`);
    console.log(`    of which the sky engine's windows and airmass: ${describeTimes(skyTimes)}`);
    console.log(`    ranking core alone: ${describeTimes(core)}`);

    // 2. The splice: approvals on distinct nights and telescopes, each cutting into blocks.
    await getNoticeQueue(); // start the enqueue side outside the measurement
    const horizonEnd = new Date(now.getTime() + 60 * 24 * HOUR);
    const nights = new Map<string, Array<{ start: number; end: number }>>();
    for (const t of telescopes) {
      const rows = await listImpactBlocks(db, [t.id], new Date(now.getTime() + 24 * HOUR), horizonEnd);
      const byNight = new Map<string, { start: number; end: number }>();
      for (const b of rows) {
        const night = new Date(b.start - 12 * HOUR).toISOString().slice(0, 10);
        if (!byNight.has(night) && b.kind !== "too") byNight.set(night, { start: b.start, end: b.end });
      }
      nights.set(t.id, [...byNight.values()]);
    }
    const spliceTimes: number[] = [];
    let displaced = 0;
    for (let i = 0; i < APPROVALS; i++) {
      const t = telescopes[i % telescopes.length]!;
      const block = nights.get(t.id)?.[Math.floor(i / telescopes.length)];
      if (!block) break;
      const requestId = await makeRequest(`Splice ${i}`, 40);
      const start = new Date(block.start + 30 * MINUTE);
      const end = new Date(block.start + 150 * MINUTE); // often past the first block: a trim and a split or two
      const started = performance.now();
      const result = await approveRequest(db, director, { requestId, telescopeId: t.id, start, end });
      spliceTimes.push(performance.now() - started);
      displaced += result.displacedMinutes;
    }
    console.log(`  splice: ${spliceTimes.length} approvals (${Math.round(displaced)} min displaced in all): ${describeTimes(spliceTimes)}  [target p95 < 100 ms]`);

    // 3. Fifty directors approving slots that all overlap one another (starts a minute apart, 90 min long).
    const target = telescopes[0]!;
    const night = nights.get(target.id)?.[Math.ceil(APPROVALS / telescopes.length) + 2];
    if (!night) throw new Error("no free night left for the conflict test");
    const ids = await Promise.all(Array.from({ length: CONCURRENT }, (_, i) => makeRequest(`Conflict ${i}`, 50)));
    const started = performance.now();
    const outcomes = await Promise.allSettled(
      ids.map((requestId, i) =>
        approveRequest(db, director, { requestId, telescopeId: target.id, start: new Date(night.start + i * MINUTE), end: new Date(night.start + (90 + i) * MINUTE) }),
      ),
    );
    const elapsed = performance.now() - started;
    const won = outcomes.filter((o) => o.status === "fulfilled").length;
    const refused = outcomes.filter((o) => o.status === "rejected" && o.reason instanceof SlotTakenError).length;
    const other = outcomes.filter((o) => o.status === "rejected" && !(o.reason instanceof SlotTakenError));
    const rows = await db.selectFrom("blocks").select(["starts_at", "ends_at"]).where("telescope_id", "=", target.id).orderBy("starts_at").execute();
    let overlaps = 0;
    for (let i = 1; i < rows.length; i++) if (rows[i]!.starts_at < rows[i - 1]!.ends_at) overlaps++;
    const correct = won === 1 && refused === CONCURRENT - 1 && overlaps === 0;
    console.log(
      `  ${CONCURRENT} concurrent conflicting approvals: ${won} approved, ${refused} refused with the slot-taken message, ${other.length} other errors, ${overlaps} overlaps — ` +
        `${correct ? "resolved correctly" : "NOT resolved correctly"} in ${ms(elapsed)} (pool of ${process.env.DATABASE_POOL_SIZE ?? 10} connections)`,
    );
    if (other[0]?.status === "rejected") console.log(`    first other error: ${String(other[0].reason)}`);
  } finally {
    await closeNoticeQueue();
    await getDb().destroy();
    await database.drop();
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error("decisions bench failed:", error instanceof Error ? error.stack : error);
    process.exit(1);
  },
);
