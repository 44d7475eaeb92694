/** What crosses between the app's thread and a preview worker (structured clone keeps the Dates). */
import type { FeasibilityInput } from "../schemas";
import type { InstrumentRef, TelescopeSky } from "./types";

export interface PreviewTask {
  id: number;
  input: FeasibilityInput;
  telescopes: TelescopeSky[];
  instrument: InstrumentRef | null;
  /** Epoch milliseconds: the preview is computed for this instant. */
  now: number;
}

export type PreviewAnswer = { id: number; json: string; error?: undefined } | { id: number; error: string; json?: undefined };
