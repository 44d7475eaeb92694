/**
 * The live preview runs on worker threads: a report costs a few milliseconds of pure
 * arithmetic, and on the app's one request thread sixteen PIs typing at once queue behind
 * each other and behind every other page. A small pool (FEASIBILITY_WORKERS, default one
 * fewer than the cores, at least one) takes the work; each task goes to the worker with
 * the fewest waiting. A worker that dies, or takes longer than the time limit, fails only
 * its own waiting tasks and is replaced on the next call.
 *
 * Hand-written rather than a pool package: Next's bundler only bundles a worker written as
 * `new Worker(new URL("./file.ts", import.meta.url))`, and pool packages load their task
 * files by name at run time, which the production build cannot see.
 */
import { availableParallelism } from "node:os";
import { Worker } from "node:worker_threads";
import { processShared } from "@/lib/process-shared";
import type { FeasibilityInput } from "../schemas";
import type { PreviewAnswer, PreviewTask } from "./preview-task";
import type { InstrumentRef, TelescopeSky } from "./types";

/** Far beyond the slowest report (a month of nights for a moving target takes well under a second). */
export const PREVIEW_TIME_LIMIT_MS = 20_000;

interface Waiting {
  resolve: (json: string) => void;
  reject: (error: Error) => void;
  timer: NodeJS.Timeout;
}

interface Slot {
  worker: Worker;
  waiting: Map<number, Waiting>;
}

const pool = processShared("feasibility-preview-pool", () => ({ slots: [] as Slot[], nextId: 1 }));

export function previewWorkerCount(): number {
  const configured = Number(process.env.FEASIBILITY_WORKERS);
  if (Number.isInteger(configured) && configured > 0) return Math.min(configured, 16);
  return Math.max(1, availableParallelism() - 1);
}

// Outside Next (Vitest, tsx scripts) the worker is TypeScript: register tsx's loader in the
// thread first. Next's build sets NEXT_RUNTIME, so this branch is left out of the bundle.
const TSX_BOOTSTRAP = `import("tsx/esm/api").then((tsx) => { tsx.register(); return import(require("node:worker_threads").workerData.file); });`;

function startWorker(): Worker {
  if (!process.env.NEXT_RUNTIME) {
    return new Worker(TSX_BOOTSTRAP, { eval: true, workerData: { file: new URL("./preview-worker.ts", import.meta.url).href } });
  }
  return new Worker(new URL("./preview-worker.ts", import.meta.url));
}

function settle(slot: Slot, id: number): Waiting | undefined {
  const task = slot.waiting.get(id);
  if (!task) return undefined;
  clearTimeout(task.timer);
  slot.waiting.delete(id);
  // An idle pool never keeps the process (or a test run) alive; a busy one does.
  if (slot.waiting.size === 0) slot.worker.unref();
  return task;
}

function addSlot(): Slot {
  const slot: Slot = { worker: startWorker(), waiting: new Map() };
  const fail = (error: Error) => {
    pool.slots = pool.slots.filter((s) => s !== slot);
    for (const id of [...slot.waiting.keys()]) settle(slot, id)?.reject(error);
  };
  slot.worker.on("message", (answer: PreviewAnswer) => {
    const task = settle(slot, answer.id);
    if (answer.error !== undefined) task?.reject(new Error(answer.error));
    else task?.resolve(answer.json);
  });
  slot.worker.on("error", fail);
  slot.worker.on("exit", (code) => fail(new Error(`The feasibility worker stopped (exit code ${code}).`)));
  slot.worker.unref();
  pool.slots.push(slot);
  return slot;
}

function leastBusy(): Slot {
  while (pool.slots.length < previewWorkerCount()) addSlot();
  return pool.slots.reduce((best, slot) => (slot.waiting.size < best.waiting.size ? slot : best));
}

/** The feasibility report for the live preview, as JSON text, computed on a worker thread. */
export function previewReportJson(
  input: FeasibilityInput,
  telescopes: TelescopeSky[],
  instrument: InstrumentRef | null,
  now: Date,
  timeLimitMs = PREVIEW_TIME_LIMIT_MS,
): Promise<string> {
  const slot = leastBusy();
  const id = pool.nextId++;
  const task: PreviewTask = { id, input, telescopes, instrument, now: now.getTime() };
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => {
      settle(slot, id)?.reject(new Error(`The feasibility preview took longer than ${timeLimitMs} ms; its worker was restarted.`));
      // Whatever it is stuck on would hold up every later preview on this worker.
      pool.slots = pool.slots.filter((s) => s !== slot);
      void slot.worker.terminate();
    }, timeLimitMs);
    if (slot.waiting.size === 0) slot.worker.ref();
    slot.waiting.set(id, { resolve, reject, timer });
    slot.worker.postMessage(task);
  });
}

/** Stops the workers; their waiting tasks fail. The next preview starts new ones. */
export async function stopPreviewWorkers(): Promise<void> {
  const slots = pool.slots;
  pool.slots = [];
  await Promise.all(slots.map((s) => s.worker.terminate()));
}
