/**
 * Enqueue-to-delivered latency for a burst of 500 notice e-mails: 50 "splices" commit
 * ten block-displaced notices each (ten at a time); the worker runs with the production
 * delivery policy (or NOTICE_* overrides) against the local e-mail fake. Latency is from
 * the commit of the enqueuing transaction to the fake storing the message.
 *
 *   node_modules/.bin/tsx tests/bench/notices.bench.ts
 *
 * Needs PG_ADMIN_URL (scripts/lib.sh `pg_start` exports it); makes and drops a database
 * of its own. FAKE_EMAIL_FAIL_RATE (default 0) injects 500s to include retries.
 * Everything runs in this one process, as the worker runs inside the app.
 */
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { percentile, throwawayDatabase } from "./bench-support";

// React's production build, as under `next start`; set before anything imports React.
Object.assign(process.env, { NODE_ENV: "production" });

const TOTAL = 500;
const PER_TRANSACTION = 10;
const PARALLEL_TRANSACTIONS = 10;


const seconds = (ms: number) => `${(ms / 1000).toFixed(2)} s`;

async function main(): Promise<void> {
  const database = await throwawayDatabase("nightbreak_bench");
  const url = database.url;

  const { createDb, getDb } = await import("../../db/index");
  const { migrateToLatest } = await import("../../db/migrate");
  const { startEmailFake } = await import("../../scripts/fakes/email-server");
  const { policyFromEnv } = await import("../../lib/notices/config");
  const { noticeKey } = await import("../../lib/notices/enqueue");
  const { createResendMailer } = await import("../../lib/notices/mailer");
  const { noticeBlockDisplaced } = await import("../../lib/notices/notify");
  const { closeNoticeQueue, getNoticeQueue } = await import("../../lib/notices/queue");
  const { startNoticeWorker } = await import("../../lib/notices/worker");
  const { blockDisplaced } = await import("../support/notice-payloads");

  const migrator = createDb(url, 1);
  await migrateToLatest(migrator);
  await migrator.destroy();

  const dir = await mkdtemp(join(tmpdir(), "nightbreak-bench-"));
  const fake = await startEmailFake({ port: 0, dir, faults: { failRate: Number(process.env.FAKE_EMAIL_FAIL_RATE ?? 0) } });
  const policy = policyFromEnv();
  const worker = await startNoticeWorker({
    policy,
    appUrl: "http://127.0.0.1:3000",
    mailer: createResendMailer({ apiKey: "re_local_bench", baseUrl: fake.url, timeoutMs: policy.sendTimeoutMs }),
  });

  try {
    const db = getDb();
    const users = await db
      .insertInto("users")
      .values(Array.from({ length: TOTAL / 5 }, (_, i) => ({ email: `observer-${i}@bench.test`, name: `Observer ${i}`, password_hash: "-" })))
      .returning("id")
      .execute();
    const payloads = users.flatMap((u) => Array.from({ length: 5 }, () => blockDisplaced({ observerUserId: u.id })));
    const committedAt = new Map<string, number>();
    const batches = Array.from({ length: TOTAL / PER_TRANSACTION }, (_, i) => payloads.slice(i * PER_TRANSACTION, (i + 1) * PER_TRANSACTION));

    // Start the enqueue side's pg-boss instance outside the measurement.
    await getNoticeQueue();
    const started = Date.now();
    for (let i = 0; i < batches.length; i += PARALLEL_TRANSACTIONS) {
      await Promise.all(
        batches.slice(i, i + PARALLEL_TRANSACTIONS).map(async (batch) => {
          await db.transaction().execute(async (trx) => {
            for (const p of batch) await noticeBlockDisplaced(trx, p);
          });
          const now = Date.now();
          for (const p of batch) committedAt.set(noticeKey("block_displaced", p.displacementId, p.observerUserId), now);
        }),
      );
    }
    const enqueued = Date.now();

    // Wait on the delivery log (cheap), then read the fake's store once for the times.
    const deadline = Date.now() + Number(process.env.BENCH_TIMEOUT_S ?? 180) * 1000;
    for (;;) {
      const { n } = await db
        .selectFrom("email_deliveries")
        .select((eb) => eb.fn.countAll<number>().as("n"))
        .where("status", "in", ["sent", "failed"])
        .executeTakeFirstOrThrow();
      if (Number(n) >= TOTAL) break;
      if (Date.now() > deadline) throw new Error(`only ${n} of ${TOTAL} e-mails delivered before the timeout`);
      await new Promise((r) => setTimeout(r, 100));
    }
    const body = (await (await fetch(`${fake.url}/_messages`)).json()) as { data: Array<{ idempotency_key: string | null; created_at: string }> };
    const delivered = new Map(body.data.filter((m) => m.idempotency_key && committedAt.has(m.idempotency_key)).map((m) => [m.idempotency_key ?? "", Date.parse(m.created_at)]));
    if (delivered.size !== TOTAL) throw new Error(`the fake holds ${delivered.size} of ${TOTAL} e-mails`);
    const finished = Math.max(...delivered.values());
    const latencies = [...delivered].map(([key, at]) => at - (committedAt.get(key) ?? at)).sort((a, b) => a - b);
    const control = (await (await fetch(`${fake.url}/_control`)).json()) as { stats: Record<string, number> };

    console.log(`notices bench: burst of ${TOTAL} e-mails (${batches.length} transactions × ${PER_TRANSACTION}, ${PARALLEL_TRANSACTIONS} at a time), worker concurrency ${policy.concurrency}`);
    console.log(`  enqueue: ${seconds(enqueued - started)} for all ${TOTAL}`);
    console.log(`  delivered: all ${TOTAL} in ${seconds(finished - started)} after the first commit (${Math.round(TOTAL / ((finished - started) / 1000))}/s)`);
    console.log(`  enqueue-to-delivered latency: p50 ${seconds(percentile(latencies, 50))}, p95 ${seconds(percentile(latencies, 95))}, max ${seconds(latencies.at(-1) ?? NaN)}`);
    console.log(`  mail fake: ${JSON.stringify(control.stats)}`);
  } finally {
    await worker.stop();
    await closeNoticeQueue();
    await getDb().destroy();
    await fake.close();
    await rm(dir, { recursive: true, force: true });
    await database.drop();
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error("notices bench failed:", error instanceof Error ? error.message : error);
    process.exit(1);
  },
);
