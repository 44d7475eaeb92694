"use client";

/**
 * Saves the draft as the PI types: a change schedules a save after a pause; saves never
 * overlap (a change during a save schedules the next one); the first save creates the
 * draft and reports its id. flush() saves now and answers the draft's id, for the steps
 * that need a stored draft (attaching a file, filing).
 */
import { useCallback, useEffect, useRef, useState } from "react";
import type { ActionResult } from "@/lib/actions/result";

export type AutosaveStatus =
  | { kind: "idle" }
  | { kind: "pending" }
  | { kind: "saving" }
  | { kind: "saved"; at: string }
  | { kind: "error"; message: string };

type Save<V> = (id: string | null, values: V) => Promise<ActionResult<{ id: string; savedAt: string }>>;

const OFFLINE = "The draft could not be saved: check your connection. Everything you typed is still here.";

export function useAutosave<V>({
  initialId,
  save,
  getValues,
  onCreated,
  delayMs = 1000,
}: {
  initialId: string | null;
  save: Save<V>;
  getValues: () => V;
  onCreated?: (id: string) => void;
  delayMs?: number;
}) {
  const [status, setStatus] = useState<AutosaveStatus>({ kind: "idle" });
  const [id, setId] = useState(initialId);
  const idRef = useRef(initialId);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const running = useRef<Promise<void> | null>(null);
  const dirty = useRef(false);
  const stopped = useRef(false);

  const clearTimer = () => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
  };

  const run = useCallback(async (): Promise<void> => {
    clearTimer();
    while (running.current) await running.current;
    if (stopped.current || (!dirty.current && idRef.current)) return;
    dirty.current = false;
    setStatus({ kind: "saving" });
    running.current = (async () => {
      try {
        const answer = await save(idRef.current, getValues());
        if (answer.ok && answer.data) {
          const created = idRef.current === null;
          idRef.current = answer.data.id;
          setId(answer.data.id);
          setStatus({ kind: "saved", at: answer.data.savedAt });
          if (created) onCreated?.(answer.data.id);
        } else {
          dirty.current = true; // try again with the next change or flush
          setStatus({ kind: "error", message: answer.message ?? OFFLINE });
        }
      } catch {
        dirty.current = true;
        setStatus({ kind: "error", message: OFFLINE });
      }
    })();
    await running.current;
    running.current = null;
  }, [save, getValues, onCreated]);

  const schedule = useCallback(() => {
    if (stopped.current) return;
    dirty.current = true;
    setStatus({ kind: "pending" });
    clearTimer();
    timer.current = setTimeout(() => void run(), delayMs);
  }, [run, delayMs]);

  /** Saves now (creating the draft if need be) and answers its id, or null when saving failed. */
  const flush = useCallback(async (): Promise<string | null> => {
    if (timer.current || !idRef.current) dirty.current = true;
    await run();
    return idRef.current;
  }, [run]);

  /** No more saves (the request has been filed). */
  const stop = useCallback(() => {
    stopped.current = true;
    clearTimer();
  }, []);

  useEffect(() => clearTimer, []);

  return { id, status, schedule, flush, stop };
}
