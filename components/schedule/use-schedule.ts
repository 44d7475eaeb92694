"use client";

import useSWR from "swr";
import type { CalendarBlock } from "@/lib/schedule/calendar-queries";

export class FetchError extends Error {
  constructor(readonly status: number, message: string) {
    super(message);
  }
}

export async function fetchJson<T>(url: string, init?: RequestInit): Promise<T> {
  const response = await fetch(url, { ...init, headers: { "content-type": "application/json", ...init?.headers } });
  if (response.status === 204) return undefined as T;
  const body = (await response.json().catch(() => ({}))) as { error?: { message?: string } };
  if (!response.ok) throw new FetchError(response.status, body.error?.message ?? `The server answered ${response.status}.`);
  return body as T;
}

export function useSchedule(telescopeId: string | undefined, range: { from: string; to: string } | null) {
  const key = telescopeId && range ? `/api/v1/schedule?telescope=${telescopeId}&from=${encodeURIComponent(range.from)}&to=${encodeURIComponent(range.to)}` : null;
  return useSWR(key, (url: string) => fetchJson<{ blocks: CalendarBlock[] }>(url), { keepPreviousData: true, refreshInterval: 30_000 });
}
