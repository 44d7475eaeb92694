/**
 * A small in-process cache of the sky engine's answers, for the live preview. A night's
 * windows depend only on the site, the telescope's limits, the target, the constraints
 * and the night, never on the clock or the request's deadline, so while a PI adjusts the
 * time needed, the window or the instrument, the nights already computed are reused.
 * Least recently used answers go first. Answers are shared: callers must not mutate them.
 */
import { createHash } from "node:crypto";
import { planVisibility, type VisibilityPlan, type VisibilityRequest } from "@/lib/visibility";

const MAX_ENTRIES = 400;
const entries = new Map<string, VisibilityPlan>();

export function cachedVisibility(request: VisibilityRequest): VisibilityPlan {
  // The request is built field by field in a fixed order, so its JSON is a stable key.
  const key = createHash("sha1").update(JSON.stringify(request)).digest("base64");
  const hit = entries.get(key);
  if (hit) {
    entries.delete(key);
    entries.set(key, hit);
    return hit;
  }
  const result = planVisibility(request);
  entries.set(key, result);
  if (entries.size > MAX_ENTRIES) entries.delete(entries.keys().next().value as string);
  return result;
}
