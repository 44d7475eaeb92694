// Next.js calls register() once when a server starts. The notice e-mail worker and the
// once-a-minute job that lapses overdue requests run in the app's Node.js process (never
// in the edge runtime), unless another process runs the workers (NIGHTBREAK_WORKERS=off,
// then scripts/worker.ts). The imports stay inside the runtime check so the edge build
// never bundles them.
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME === "nodejs") {
    if (process.env.NIGHTBREAK_WORKERS === "off") return;
    const { startAppNoticeWorker } = await import("./lib/notices/worker");
    const { startAppLapseJob } = await import("./lib/requests/lapse-job");
    await Promise.all([startAppNoticeWorker(), startAppLapseJob()]);
  }
}
