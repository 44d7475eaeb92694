"use client";

import { useEffect, useState } from "react";
import useSWR from "swr";
import type { TonightQueue } from "@/lib/tonight/types";

export const POLL_MS = 5_000;
/** No fresh answer for three polls: say so. */
export const STALE_AFTER_MS = 15_000;

export type Liveness = "live" | "stale" | "offline";

export function livenessOf(online: boolean, failing: boolean, lastOk: number, now: number): Liveness {
  if (!online) return "offline";
  return failing || now - lastOk > STALE_AFTER_MS ? "stale" : "live";
}

export class QueueFetchError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

async function fetchQueue(url: string): Promise<TonightQueue> {
  const response = await fetch(url, { cache: "no-store", headers: { accept: "application/json" } });
  const body = (await response.json().catch(() => ({}))) as { error?: { message?: string } };
  if (!response.ok) {
    const message = response.status === 401 ? "Your session has ended: sign in again." : (body.error?.message ?? `The server answered ${response.status}.`);
    throw new QueueFetchError(response.status, message);
  }
  return body as TonightQueue;
}

export function queueUrl(telescopeCode: string, night: string | null): string {
  return `/api/v1/telescopes/${encodeURIComponent(telescopeCode)}/queue${night ? `?night=${night}` : ""}`;
}

function useOnline(): boolean {
  const [online, setOnline] = useState(true);
  useEffect(() => {
    const update = () => setOnline(navigator.onLine);
    update();
    window.addEventListener("online", update);
    window.addEventListener("offline", update);
    return () => {
      window.removeEventListener("online", update);
      window.removeEventListener("offline", update);
    };
  }, []);
  return online;
}

/** A clock for the page: starts at the server's "now" (so hydration matches), then ticks. */
export function useNow(initial: string, everyMs: number): number {
  const [now, setNow] = useState(() => Date.parse(initial));
  useEffect(() => {
    setNow(Date.now());
    const timer = setInterval(() => setNow(Date.now()), everyMs);
    return () => clearInterval(timer);
  }, [everyMs]);
  return now;
}

/**
 * Tonight's queue, polled every few seconds, with what it takes to say how fresh it is:
 * whether the browser is online, the last failure, and when the last good answer came.
 */
export function useTonightQueue(url: string, initial: TonightQueue) {
  const [lastOk, setLastOk] = useState(() => Date.parse(initial.now));
  const online = useOnline();
  const swr = useSWR<TonightQueue, QueueFetchError>(url, fetchQueue, {
    fallbackData: initial,
    refreshInterval: POLL_MS,
    revalidateOnFocus: true,
    dedupingInterval: 1_000,
    keepPreviousData: true,
    onSuccess: () => setLastOk(Date.now()),
  });
  return { queue: swr.data ?? initial, error: swr.error, refresh: swr.mutate, online, lastOk };
}
