/**
 * The clock behind lapsing: a pg-boss schedule puts one job a minute on the
 * `request-lapse` queue, and whichever process takes it runs lapseOverdueRequests. pg-boss
 * keeps the cron to one job per minute however many processes run it, and the queue's
 * `stately` policy keeps at most one waiting and one running, so a stopped worker does not
 * come back to a pile of missed minutes. Lapsing itself is safe to run concurrently, so
 * none of this is needed for correctness, only to keep the work small.
 *
 * Started with the app (instrumentation.ts → startAppLapseJob) and by scripts/worker.ts,
 * in its own small pg-boss instance: it must run even where no mail service is configured.
 */
import PgBoss from "pg-boss";
import { getDb, type Db } from "@/db/index";
import { bossOptions } from "@/lib/notices/queue";
import { lapseOverdueRequests } from "./lapse";

export const LAPSE_QUEUE = "request-lapse";
/** Every minute, UT. */
export const LAPSE_CRON = "* * * * *";

export interface LapseJob {
  stop(): Promise<void>;
}

export async function startLapseJob(options: { connectionString?: string; db?: Db } = {}): Promise<LapseJob> {
  const connectionString = options.connectionString ?? process.env.DATABASE_URL;
  if (!connectionString) throw new Error("DATABASE_URL is not set");
  const db = options.db ?? getDb();
  const boss = new PgBoss(bossOptions(connectionString, { max: 2, schedule: true, supervise: true, application_name: "nightbreak-lapse" }));
  boss.on("error", (error) => console.error("lapse job:", error.message));
  await boss.start();
  await boss.createQueue(LAPSE_QUEUE, { name: LAPSE_QUEUE, policy: "stately", retryLimit: 0, expireInSeconds: 300 });
  await boss.schedule(LAPSE_QUEUE, LAPSE_CRON, {}, { tz: "UTC" });
  await boss.work(LAPSE_QUEUE, { batchSize: 1, pollingIntervalSeconds: 5 }, async () => {
    await lapseOverdueRequests(db, new Date());
  });
  return {
    async stop() {
      await boss.stop({ graceful: true, timeout: 10_000, wait: true });
    },
  };
}

// One per app process, kept across dev hot reloads.
const holder = globalThis as unknown as { nightbreakLapseJob?: Promise<LapseJob | null> };

/** For instrumentation.ts: starts the job once; never throws (the app must still serve pages). */
export function startAppLapseJob(): Promise<LapseJob | null> {
  holder.nightbreakLapseJob ??= (async () => {
    if (!process.env.DATABASE_URL) return null;
    try {
      const job = await startLapseJob();
      console.log("request lapse job started");
      return job;
    } catch (error) {
      console.error("request lapse job not started:", error instanceof Error ? error.message : error);
      return null;
    }
  })();
  return holder.nightbreakLapseJob;
}
