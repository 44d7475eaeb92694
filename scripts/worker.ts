/**
 * The notice e-mail worker on its own, outside the web server: for running delivery in
 * a separate process (start the app with NIGHTBREAK_WORKERS=off) and for the tests that
 * kill a worker mid-burst. Env: DATABASE_URL, RESEND_API_KEY, RESEND_BASE_URL, APP_URL,
 * EMAIL_FROM and the NOTICE_* tuning variables of lib/notices/config.ts.
 */
import { startNoticeWorker } from "../lib/notices/worker";

const worker = await startNoticeWorker();
console.log("notice worker ready");

let stopping = false;
const stop = (): void => {
  if (stopping) return;
  stopping = true;
  worker.stop().then(
    () => process.exit(0),
    () => process.exit(1),
  );
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
