"use client";

import useSWR from "swr";
import { fetchJson } from "@/components/schedule/use-schedule";
import type { ImpactJson } from "@/lib/impact/json";

export interface SlotChoice {
  telescopeId: string;
  start: number;
  end: number;
}

export function impactUrl(slot: SlotChoice): string {
  const iso = (ms: number) => encodeURIComponent(new Date(ms).toISOString());
  return `/api/v1/impact?telescope=${slot.telescopeId}&start=${iso(slot.start)}&end=${iso(slot.end)}`;
}

/** The live impact of the chosen slot; null while the slot is not a valid one. */
export function useImpact(slot: SlotChoice | null) {
  const key = slot && slot.end > slot.start ? impactUrl(slot) : null;
  return useSWR(key, (url: string) => fetchJson<{ impact: ImpactJson }>(url).then((r) => r.impact), { keepPreviousData: true, revalidateOnFocus: true });
}
