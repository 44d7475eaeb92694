/**
 * The preview's worker thread (started by preview-pool.ts): computes a feasibility report
 * and sends it back as JSON text, so neither the sky engine nor the 60 KB of JSON holds up
 * the app's request thread. Keeps its own cache of nights (cache.ts) between calls.
 */
import { parentPort } from "node:worker_threads";
import { cachedVisibility } from "./cache";
import { computeFeasibility } from "./compute";
import type { PreviewTask, PreviewAnswer } from "./preview-task";

parentPort?.on("message", (task: PreviewTask) => {
  let answer: PreviewAnswer;
  try {
    const report = computeFeasibility(task.input, task.telescopes, task.instrument, new Date(task.now), { visibility: cachedVisibility });
    answer = { id: task.id, json: JSON.stringify(report) };
  } catch (error) {
    console.error("feasibility preview failed:", error);
    answer = { id: task.id, error: error instanceof Error ? error.message : String(error) };
  }
  parentPort?.postMessage(answer);
});
