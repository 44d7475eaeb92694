/**
 * The workers on their own, outside the web server: notice e-mail delivery and the
 * once-a-minute job that lapses overdue requests. For running them in a separate process
 * (start the app with NIGHTBREAK_WORKERS=off) and for the tests that kill a worker
 * mid-burst. Env: DATABASE_URL, RESEND_API_KEY, RESEND_BASE_URL, APP_URL, EMAIL_FROM and
 * the NOTICE_* tuning variables of lib/notices/config.ts.
 */
import { startNoticeWorker } from "../lib/notices/worker";
import { startLapseJob } from "../lib/requests/lapse-job";

const worker = await startNoticeWorker();
const lapse = await startLapseJob();
console.log("notice worker ready");

let stopping = false;
const stop = (): void => {
  if (stopping) return;
  stopping = true;
  Promise.all([worker.stop(), lapse.stop()]).then(
    () => process.exit(0),
    () => process.exit(1),
  );
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
