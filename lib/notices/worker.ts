/**
 * The e-mail worker: takes queued notice e-mails from pg-boss, renders and sends them
 * through the Resend SDK, records each outcome in the delivery log. A failed send that
 * may succeed later (network, 429, 5xx) throws, and pg-boss retries it with exponential
 * backoff; a job whose worker died is handed out again once it expires. Each of
 * `concurrency` pg-boss workers takes one job at a time, keeps going while there is
 * work, and is woken by NOTIFY when a new e-mail is committed.
 *
 * Started with the app (instrumentation.ts → startAppNoticeWorker) and standalone by
 * scripts/worker.ts.
 */
import pg from "pg";
import PgBoss from "pg-boss";
import { getDb, type Db } from "@/db/index";
import { policyFromEnv, type DeliveryPolicy } from "./config";
import { deliverNoticeJob, type DeliveryContext } from "./deliver";
import { appBaseUrl } from "./links";
import { mailerFromEnv, senderAddress, type Mailer } from "./mailer";
import { bossOptions, ensureQueue, NOTICE_QUEUE, WAKE_CHANNEL } from "./queue";

export interface NoticeWorkerOptions {
  connectionString?: string;
  policy?: DeliveryPolicy;
  mailer?: Mailer;
  db?: Db;
  from?: string;
  appUrl?: string;
}

export interface NoticeWorker {
  stop(): Promise<void>;
}

export class MailerNotConfiguredError extends Error {}

export async function startNoticeWorker(options: NoticeWorkerOptions = {}): Promise<NoticeWorker> {
  const policy = options.policy ?? policyFromEnv();
  const connectionString = options.connectionString ?? process.env.DATABASE_URL;
  if (!connectionString) throw new Error("DATABASE_URL is not set");
  const mailer = options.mailer ?? mailerFromEnv(policy.sendTimeoutMs);
  if (!mailer) throw new MailerNotConfiguredError("RESEND_API_KEY is not set: notice e-mails stay queued until a worker can send them");
  const ctx: DeliveryContext = { db: options.db ?? getDb(), mailer, from: options.from ?? senderAddress(), appUrl: options.appUrl ?? appBaseUrl() };

  const boss = new PgBoss(
    bossOptions(connectionString, {
      max: policy.concurrency + 2,
      application_name: "nightbreak-notice-worker",
      supervise: true,
      maintenanceIntervalSeconds: policy.maintenanceIntervalSeconds,
    }),
  );
  boss.on("error", (error) => console.error("notice worker:", error.message));
  await boss.start();
  await ensureQueue(boss, policy, true);

  const workerIds: string[] = [];
  for (let i = 0; i < policy.concurrency; i += 1) {
    const self = { id: "" };
    self.id = await boss.work<unknown>(
      NOTICE_QUEUE,
      { batchSize: 1, includeMetadata: true, pollingIntervalSeconds: policy.pollingIntervalSeconds },
      async (jobs) => {
        // Found work: fetch again right after this job instead of sleeping until the next poll.
        if (self.id) boss.notifyWorker(self.id);
        for (const job of jobs) await deliverNoticeJob(job, ctx);
      },
    );
    workerIds.push(self.id);
  }
  const wakeups = listenForWakeups(connectionString, () => workerIds.forEach((id) => boss.notifyWorker(id)));

  return {
    async stop() {
      await wakeups.close();
      // Waits for jobs in hand; any still running after the timeout go back to the queue.
      await boss.stop({ graceful: true, timeout: 10_000, wait: true });
    },
  };
}

/** LISTEN on its own connection; reconnects after a failure. Polling covers any gap. */
function listenForWakeups(connectionString: string, wake: () => void): { close(): Promise<void> } {
  let client: pg.Client | null = null;
  let closed = false;
  let timer: NodeJS.Timeout | undefined;

  const retryLater = () => {
    client = null;
    if (!closed && !timer) timer = setTimeout(() => void connect(), 2_000);
  };
  const connect = async () => {
    timer = undefined;
    if (closed) return;
    const c = new pg.Client({ connectionString, application_name: "nightbreak-notice-wakeup" });
    c.on("notification", wake);
    c.on("error", () => undefined);
    c.on("end", () => {
      if (client === c) retryLater();
    });
    try {
      await c.connect();
      await c.query(`LISTEN ${WAKE_CHANNEL}`);
      client = c;
      if (closed) await c.end();
    } catch {
      await c.end().catch(() => undefined);
      retryLater();
    }
  };
  void connect();
  return {
    async close() {
      closed = true;
      if (timer) clearTimeout(timer);
      const c = client;
      client = null;
      await c?.end().catch(() => undefined);
    },
  };
}

// One worker per app process, kept across dev hot reloads.
const holder = globalThis as unknown as { nightbreakNoticeWorker?: Promise<NoticeWorker | null> };

/** For instrumentation.ts: starts the worker once; never throws (the app must still serve pages). */
export function startAppNoticeWorker(): Promise<NoticeWorker | null> {
  holder.nightbreakNoticeWorker ??= (async () => {
    if (!process.env.DATABASE_URL) return null;
    try {
      const worker = await startNoticeWorker();
      console.log("notice worker started");
      return worker;
    } catch (error) {
      console.error("notice worker not started:", error instanceof Error ? error.message : error);
      return null;
    }
  })();
  return holder.nightbreakNoticeWorker;
}
